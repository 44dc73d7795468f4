/**
 * Values computed from a diagram on first use and kept for that diagram. A
 * registered invariant declares its computation as a `Quantity`; nothing is
 * computed until a claim, a fill-in, a table cell or a JSON field reads it.
 */
import type { LinkDiagram } from '../../diagram/model.ts';
import type { DiagramReport } from '../../analyze/report.ts';

export interface Quantity<T> {
  /** For messages and debugging only; identity is the object itself. */
  readonly name: string;
  /** Computes the value; may read other quantities or fields of the report (each computed once). */
  readonly compute: (report: DiagramReport) => T;
}

export function quantity<T>(name: string, compute: (report: DiagramReport) => T): Quantity<T> {
  return { name, compute };
}

const memo = new WeakMap<LinkDiagram, Map<Quantity<unknown>, unknown>>();

/** The value of `q` for the report's diagram, computed on the first call and remembered with the diagram. */
export function valueOf<T>(report: DiagramReport, q: Quantity<T>): T {
  let values = memo.get(report.diagram);
  if (!values) memo.set(report.diagram, (values = new Map()));
  if (values.has(q)) return values.get(q) as T;
  const value = q.compute(report);
  values.set(q, value);
  return value;
}

/**
 * Defines `name` on `target` as an enumerable property computed by `compute` on first read and then
 * stored as a plain value, so later reads cost nothing.
 */
export function defineLazy<T extends object>(target: T, name: string, compute: () => unknown): void {
  Object.defineProperty(target, name, {
    enumerable: true,
    configurable: true,
    get() {
      const value = compute();
      Object.defineProperty(target, name, { value, enumerable: true, writable: false, configurable: false });
      return value;
    },
  });
}
