/**
 * What a pool worker can be asked to compute: each kind names the function it
 * runs on every task. A worker loads only the module of its kind.
 */
import type { BatchOptions } from '../batch-line.ts';
import type { DiagramJob } from '../diagram-values.ts';

export type PoolJob = { readonly kind: 'batch-line'; readonly options: BatchOptions } | { readonly kind: 'diagram-values'; readonly job: DiagramJob };

/** The function a worker applies to each task of `job`. */
export async function taskRunner(job: PoolJob): Promise<(task: never) => unknown> {
  switch (job.kind) {
    case 'batch-line': {
      const [{ batchLine }, { printedLine }] = await Promise.all([import('../batch-line.ts'), import('../batch-pool.ts')]);
      return (task: { readonly text: string; readonly lineNumber: number }) => printedLine(batchLine(task.text, task.lineNumber, job.options));
    }
    case 'diagram-values': {
      const { diagramValuesRunner } = await import('../diagram-values.ts');
      return diagramValuesRunner(job.job);
    }
  }
}
