/** Every `compute --json` field of the registry for one diagram, in the default convention. */
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { DEFAULT_CONVENTION } from '../../src/core/convention/convention.ts';
import type { LinkDiagram } from '../../src/core/diagram/model.ts';
import { INVARIANTS } from '../../src/core/invariants/registry/index.ts';

export function registryFields(d: LinkDiagram): Map<string, unknown> {
  const report = analyzeDiagram(d);
  const fields = new Map<string, unknown>();
  for (const invariant of INVARIANTS) for (const f of invariant.json) fields.set(f.field, f.value(report, DEFAULT_CONVENTION));
  return fields;
}
