import type { NetworkDocument } from '../../shared/engine/network/types';
import { Card } from '../ui/Card';
import { BlocksView, RecursionRounds } from './LargeSolverDetail';
import type { RunDetail, RunJob } from './types';

/** On the run screen: RQAOA's rounds and qaoa-blocks' blocks, one card per finished job that reports them. */
export function LargeSolverPanels(props: { run: RunDetail; document: Pick<NetworkDocument, 'depots' | 'lanes'> | undefined; labelOf: (job: RunJob) => string; wide: boolean }) {
  const done = props.run.jobs.filter((j) => j.status === 'succeeded' && j.result);
  return (
    <>
      {done.filter((j) => j.result!.recursion).map((j) => (
        <Card key={`rounds-${j.id}`}>
          <RecursionRounds recursion={j.result!.recursion!} label={props.labelOf(j)} wide={props.wide} />
        </Card>
      ))}
      {props.document ? done.filter((j) => j.result!.decomposition).map((j) => (
        <Card key={`blocks-${j.id}`}>
          <BlocksView decomposition={j.result!.decomposition!} document={props.document!} label={props.labelOf(j)} />
        </Card>
      )) : null}
    </>
  );
}
