import type { Deps } from '../deps';
import { runSeconds, type RunStatus } from '../../shared/schemas/runs';

export interface FinishedJobLine {
  solver: string;
  status: string;
  value: number | null;
  gap: number | null;
  error: string | null;
}

const OUTCOME: Record<string, string> = {
  succeeded: 'finished',
  partial: 'finished with some solvers failed or cancelled',
  failed: 'failed',
  cancelled: 'was cancelled',
};

/** The "your run finished" message: outcome per solver and a link to the run page. */
export function runFinishedMail(publicUrl: string, run: { id: number; networkName: string | null; status: RunStatus; seconds: number }, jobs: FinishedJobLine[]) {
  const link = `${publicUrl}/runs/${run.id}`;
  const lines = jobs.map((j) => {
    if (j.status === 'succeeded' || (j.status === 'cancelled' && j.value !== null)) {
      const gap = j.gap === null ? 'no proven bound' : `gap ${(100 * j.gap).toFixed(2)} % to the bound`;
      return `- ${j.solver}: ${j.status}, value ${j.value}, ${gap}`;
    }
    return `- ${j.solver}: ${j.status}${j.error ? ` — ${j.error}` : ''}`;
  });
  const where = run.networkName ? ` on "${run.networkName}"` : '';
  return {
    subject: `Spinyard run #${run.id}${where} ${OUTCOME[run.status] ?? run.status}`,
    text: [
      `Your run #${run.id}${where} ${OUTCOME[run.status] ?? run.status} after ${Math.round(run.seconds)} s.`,
      '',
      ...lines,
      '',
      `See the comparison, the bound and the assignment: ${link}`,
      '',
      'Spinyard is decision support: check the split against what you know about your depots before you act on it.',
    ].join('\n'),
  };
}

/** Send it to the run's creator (no creator or no e-mail address: nothing to send). */
export async function sendRunFinishedMail(deps: Pick<Deps, 'models' | 'mailer' | 'config' | 'logger'>, runId: number): Promise<boolean> {
  const { Run, RunJob, User, Network } = deps.models;
  const run = await Run.findByPk(runId);
  if (!run) return false;
  const createdBy = run.get('createdBy') as number | null;
  const user = createdBy ? await User.findByPk(createdBy) : null;
  if (!user) return false;
  const network = await Network.findByPk(run.get('networkId') as number);
  const jobs = await RunJob.findAll({ where: { runId }, order: [['position', 'ASC']] });
  const lines: FinishedJobLine[] = jobs.map((j) => {
    const result = j.get('result') ? (JSON.parse(j.get('result') as string) as { value: number; gap: number | null }) : null;
    return { solver: j.get('solver') as string, status: j.get('status') as string, value: result?.value ?? null, gap: result?.gap ?? null, error: (j.get('error') as string | null) ?? null };
  });
  const finishedAt = (run.get('finishedAt') as Date | null) ?? new Date();
  const seconds = runSeconds({ status: run.get('status') as RunStatus, createdAt: run.get('createdAt') as Date, releasedAt: run.get('releasedAt') as Date | null, finishedAt }, finishedAt.getTime()) ?? 0;
  const mail = runFinishedMail(deps.config.publicUrl, { id: runId, networkName: network ? (network.get('name') as string) : null, status: run.get('status') as RunStatus, seconds }, lines);
  await deps.mailer.send({ to: user.email, ...mail });
  return true;
}
