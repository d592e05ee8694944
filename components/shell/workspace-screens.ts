/**
 * The screens that draw (networks, runs, compare, report, setup, import): one module so the
 * bundler puts them and their drawing code (d3, SVG, charts) into one chunk, loaded on first use
 * through lazy-screen.tsx. Routes never import these directly, or the code would move into the
 * common chunk every page (sign-in included) loads.
 */
export { NetworkScreen } from '../networks/NetworkScreen';
export { NewNetworkScreen } from '../networks/NewNetworkScreen';
export { ImportScreen } from '../networks/ImportScreen';
export { RunView } from '../runs/RunView';
export { RunSetup } from '../runs/RunSetup';
export { CompareView } from '../runs/CompareView';
export { RunReport } from '../runs/RunReport';
