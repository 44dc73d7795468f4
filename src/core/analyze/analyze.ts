/**
 * analyzeDiagram: the DiagramReport of one diagram, whose every field is
 * computed on first read and then kept (one report per diagram object), so a
 * document pays only for the invariants it states, fills or tabulates.
 * Registered invariants add their own values through `valueOf` (see
 * src/core/invariants/registry/lazy.ts).
 */
import { componentCount } from '../diagram/model.ts';
import type { LinkDiagram } from '../diagram/model.ts';
import { diagramProperties } from '../diagram/properties.ts';
import type { DiagramProperties } from '../diagram/properties.ts';
import { crossingNumberBounds } from '../diagram/crossing-bounds.ts';
import { splitPieces } from '../diagram/operations.ts';
import { kauffmanBracket } from '../invariants/bracket.ts';
import { jonesFromBracket } from '../invariants/jones.ts';
import { classicalInvariantsWithin, genusBounds } from '../invariants/classical/index.ts';
import { defineLazy } from '../invariants/registry/lazy.ts';
import type { CrossingNumberBounds, DiagramReport } from './report.ts';
import { describeFamily, familyOf } from '../families/identity.ts';
import { once, withTimeBudget, type ComputeLimits } from '../limits.ts';
import { describeMoves, simplifyDiagram } from '../simplify/simplify.ts';
import { attachStore, throughStore, type ResultStore } from '../cache/store.ts';
import { STORED } from '../cache/stored.ts';
import type { ClassicalInvariants } from '../invariants/classical/index.ts';

const reports = new WeakMap<LinkDiagram, DiagramReport>();

/**
 * `limits` (none by default; those of the first call for a diagram hold) bound the bracket's state
 * memory and give each computation (the bracket, the classical invariants) its own time budget; a limit
 * that is hit throws a LimitError when the field is read, and again at once on every later read.
 * With a `store` (that of the first call holds), the values it keeps (src/core/cache/stored.ts) are read
 * from it when present and written to it when computed.
 */
export function analyzeDiagram(d: LinkDiagram, limits: ComputeLimits = {}, store?: ResultStore): DiagramReport {
  let report = reports.get(d);
  if (!report) {
    reports.set(d, (report = lazyReport(d, limits, store)));
    if (store) attachStore(report, store);
  }
  return report;
}

function lazyReport(d: LinkDiagram, limits: ComputeLimits, store: ResultStore | undefined): DiagramReport {
  let properties: DiagramProperties | undefined;
  const props = (): DiagramProperties => (properties ??= diagramProperties(d));
  const bracketLimits = limits.maxStateBytes !== undefined ? { maxStateBytes: limits.maxStateBytes } : {};
  const bracketResult = once(() => withTimeBudget(limits.timeBudgetMs, 'its Kauffman bracket', () => kauffmanBracket(d, undefined, bracketLimits)));
  // Each classical invariant is computed on its own, on first read, with its own time budget.
  const classical = once(() => storedClassical(d, classicalInvariantsWithin(d, limits.timeBudgetMs), store));
  const family = familyOf(d);
  const boundInput = () => ({
    properties: props(),
    jonesSpan: r.jones.span,
    // Pieces of a disconnected diagram are connected, so this recursion is one level deep.
    pieces: props().connected ? undefined : splitPieces(d).map((piece) => analyzeDiagram(piece, limits, store).crossingNumber),
    ...(family ? { family } : {}),
  });
  let plain: CrossingNumberBounds | undefined;
  /** The bounds without simplification: the theorems about this diagram as drawn. */
  const plainBounds = () => (plain ??= crossingNumberBounds(boundInput()));
  const report = { diagram: d, limits, notation: d.notation, chiralityFixed: d.chiralityFixed } as Record<string, unknown>;
  const r = report as unknown as DiagramReport;
  const fields: Record<string, () => unknown> = {
    crossings: () => props().crossings,
    components: () => componentCount(d),
    writhe: () => props().writhe,
    positiveCrossings: () => props().signs.positive,
    negativeCrossings: () => props().signs.negative,
    linking: () => props().linking,
    bracket: () => throughStore(store, STORED.bracket, d, () => bracketResult().bracket),
    jones: () => jonesFromBracket(r.bracket, r.writhe),
    span: () => r.jones.span,
    // The bracket and V of a diagram are never zero, so the degrees exist.
    jonesMinDegree: () => r.jones.minDegree ?? 0,
    jonesMaxDegree: () => r.jones.maxDegree ?? 0,
    bracketSpan: () => r.bracket.span,
    bracketMinDegree: () => r.bracket.minDegree ?? 0,
    bracketMaxDegree: () => r.bracket.maxDegree ?? 0,
    connected: () => props().connected,
    nugatory: () => props().nugatory,
    reduced: () => props().reduced,
    alternating: () => props().alternating,
    aAdequate: () => props().aAdequate,
    bAdequate: () => props().bAdequate,
    adequate: () => props().adequate,
    stateCircles: () => props().stateCircles,
    crossingNumber: () =>
      throughStore(store, STORED.crossingNumber, d, () => {
        const smaller = plainBounds().exact === null ? r.simplified : undefined;
        if (!smaller) return plainBounds();
        const simplified = { crossings: smaller.diagram.crossings.length, moves: smaller.description, flyped: smaller.moves.flypes > 0, bounds: analyzeDiagram(smaller.diagram, limits, store).crossingNumber };
        return crossingNumberBounds({ ...boundInput(), simplified });
      }),
    simplified: () =>
      throughStore(store, STORED.simplified, d, () => {
        // Only worth a search when no theorem has decided the number without it.
        if (plainBounds().exact !== null) return null;
        const { diagram, moves } = simplifyDiagram(d);
        if (diagram.crossings.length >= plainBounds().upper) return null;
        return { diagram, moves, description: describeMoves(moves) };
      }) ?? undefined,
    family: () => (family ? { identity: family, description: describeFamily(family, componentCount(d)) } : undefined),
    boundaryWidth: () => throughStore(store, STORED.boundaryWidth, d, () => bracketResult().boundaryWidth),
    classical,
  };
  for (const [name, compute] of Object.entries(fields)) defineLazy(report, name, compute);
  return r;
}

/** The classical invariants with the stored ones read through `store`; the others as computed. */
function storedClassical(d: LinkDiagram, computed: ClassicalInvariants, store: ResultStore | undefined): ClassicalInvariants {
  if (!store) return computed;
  const result = Object.create(computed) as Record<string, unknown>;
  for (const name of ['alexander', 'conway', 'determinant', 'signature'] as const) {
    defineLazy(result, name, () => throughStore<unknown>(store, STORED[name] as never, d, () => computed[name]));
  }
  // Read from the stored Δ and σ, so a genus claim does not compute them again.
  const c = result as unknown as ClassicalInvariants;
  defineLazy(result, 'genusBounds', () => (c.split ? [] : genusBounds(c.alexander, c.signature, componentCount(d), d.crossings.length, c.seifertCircles)));
  return result as unknown as ClassicalInvariants;
}
