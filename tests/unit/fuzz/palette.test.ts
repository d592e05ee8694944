import { colors, regionColors } from '../../../components/theme';
import { deltaE, lab, simulate } from '../../support/colour';

/**
 * Our palette is our own: no value equals (or nearly equals) a well-known default of a public
 * design system or chart library, and the region colours stay apart for common colour vision
 * deficiencies. The lists below are from memory (marked per group); they name values we avoid,
 * they are not used anywhere in the product.
 */
const WELL_KNOWN: Record<string, string[]> = {
  // d3 schemeCategory10 (= matplotlib/Vega "tab10") [from memory]
  'd3 category10': ['#1F77B4', '#FF7F0E', '#2CA02C', '#D62728', '#9467BD', '#8C564B', '#E377C2', '#7F7F7F', '#BCBD22', '#17BECF'],
  // Tableau 10 (2016 default) [from memory]
  'Tableau 10': ['#4E79A7', '#F28E2B', '#E15759', '#76B7B2', '#59A14F', '#EDC948', '#B07AA1', '#FF9DA7', '#9C755F', '#BAB0AC'],
  // d3 schemeObservable10 [from memory]
  'Observable 10': ['#4269D0', '#EFB118', '#FF725C', '#6CC5B0', '#3CA951', '#FF8AB7', '#A463F2', '#97BBF5', '#9C6B4E', '#9498A0'],
  // ColorBrewer Set1, Set2, Dark2 (Brewer, colorbrewer2.org) [from memory]
  'ColorBrewer': ['#E41A1C', '#377EB8', '#4DAF4A', '#984EA3', '#FF7F00', '#FFFF33', '#A65628', '#F781BF', '#999999',
    '#66C2A5', '#FC8D62', '#8DA0CB', '#E78AC3', '#A6D854', '#FFD92F', '#E5C494', '#B3B3B3',
    '#1B9E77', '#D95F02', '#7570B3', '#E7298A', '#66A61E', '#E6AB02', '#A6761D', '#666666'],
  // Okabe & Ito, "Color universal design" (2008) [from memory]
  'Okabe–Ito': ['#E69F00', '#56B4E9', '#009E73', '#F0E442', '#0072B2', '#D55E00', '#CC79A7'],
  // Office / Google Charts default series [from memory]
  'office and charts': ['#4472C4', '#ED7D31', '#A5A5A5', '#FFC000', '#5B9BD5', '#70AD47', '#3366CC', '#DC3912', '#FF9900', '#109618', '#990099', '#0099C6'],
  // GitHub Primer accents and danger [from memory]
  'Primer': ['#0969DA', '#1F6FEB', '#218BFF', '#58A6FF', '#CF222E', '#D1242F', '#DA3633', '#F85149', '#1A7F37', '#2DA44E'],
  // Material Design 2 and 3 (primary, error, red/deep-orange tints) [from memory]
  'Material': ['#6750A4', '#B3261E', '#BA1A1A', '#F2B8B5', '#F9DEDC', '#1976D2', '#2196F3', '#1E88E5', '#F44336', '#D32F2F', '#B00020', '#FFEBEE', '#FBE9E7', '#E8DEF8'],
  // Tailwind CSS blue/red/amber 500–700 [from memory]
  'Tailwind': ['#3B82F6', '#2563EB', '#1D4ED8', '#EF4444', '#DC2626', '#B91C1C', '#F59E0B', '#D97706', '#B45309'],
  // Bootstrap 5, IBM Carbon, Atlassian, Ant Design, Apple, Fluent, GOV.UK, Polaris, Chakra [from memory]
  'other systems': ['#0D6EFD', '#DC3545', '#198754', '#FFC107', '#0F62FE', '#DA1E28', '#0052CC', '#DE350B', '#1677FF', '#1890FF', '#FF4D4F', '#F5222D',
    '#007AFF', '#FF3B30', '#0A84FF', '#FF453A', '#0078D4', '#D13438', '#A4262C', '#1D70B8', '#D4351C', '#FFDD00', '#2C6ECB', '#D72C0D', '#3182CE', '#E53E3E'],
};

const ours: Array<[string, string]> = [
  ...Object.entries(colors).map(([k, v]) => [`colors.${k}`, v] as [string, string]),
  ...regionColors.map((v, i) => [`regionColors[${i}]`, v] as [string, string]),
];
const known = Object.entries(WELL_KNOWN).flatMap(([from, list]) => list.map((hex) => [from, hex] as const));

test('the colour arithmetic reproduces textbook values (CIE L*a*b* of white and of sRGB red ≈ 53.2, 80.1, 67.2 [from memory])', () => {
  const white = lab('#FFFFFF');
  expect(white[0]).toBeCloseTo(100, 1);
  expect(Math.abs(white[1]) + Math.abs(white[2])).toBeLessThan(0.05);
  const red = lab('#FF0000');
  expect(red[0]).toBeCloseTo(53.24, 0);
  expect(red[1]).toBeCloseTo(80.09, 0);
  expect(red[2]).toBeCloseTo(67.2, 0);
});

test('no palette value is a well-known default, exactly or within ΔE*ab 3 (a barely visible step)', () => {
  const clashes: string[] = [];
  for (const [name, hex] of ours) for (const [from, k] of known) {
    if (hex.toUpperCase() === k.toUpperCase() || deltaE(hex, k) < 3) clashes.push(`${name} ${hex} ≈ ${from} ${k}`);
  }
  expect(clashes).toEqual([]);
});

test('the check does catch a default (the earlier accent blue and error red)', () => {
  const hits = (hex: string) => known.filter(([, k]) => deltaE(hex, k) < 3).map(([from]) => from);
  expect(hits('#1F6FEB')).toContain('Primer');
  expect(hits('#B3261E')).toContain('Material');
  expect(hits('#1F77B5')).toContain('d3 category10'); // one unit off still counts
});

describe('region colours stay apart', () => {
  // Our own thresholds: ΔE*ab ≥ 30 in normal vision and ≥ 20 with full protanopia or
  // deuteranopia (Machado et al. 2009 simulation), for every pair; the two sides of a cut ≥ 60.
  const minPair = (list: readonly string[]) => {
    let min = Infinity;
    for (let i = 0; i < list.length; i++) for (let j = i + 1; j < list.length; j++) min = Math.min(min, deltaE(list[i], list[j]));
    return min;
  };
  test('normal vision', () => expect(minPair(regionColors)).toBeGreaterThanOrEqual(30));
  test.each(['protan', 'deutan'] as const)('%s', (kind) => {
    expect(minPair(regionColors.map((c) => simulate(c, kind)))).toBeGreaterThanOrEqual(20);
    expect(deltaE(simulate(regionColors[0], kind), simulate(regionColors[1], kind))).toBeGreaterThanOrEqual(60);
  });
  test('the previous, chart-default-like set fails the same rule (the check can fail)', () => {
    const previous = ['#2D6A9F', '#D0782A', '#4E9A6B', '#8E5BA8', '#C9A227', '#3A8C8C', '#B0476B', '#6B6F2A'];
    expect(minPair(previous.map((c) => simulate(c, 'deutan')))).toBeLessThan(20);
  });
});
