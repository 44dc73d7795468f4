/**
 * The build's substitutions applied to the tree instead of the text, for
 * pipelines that go on to HTML (remark-rehype, rehype-katex): fill-ins become
 * inline math, claims and the `:::invariants` container give way to what the
 * author wrote inside them, and a figure becomes its HTML block.
 */
import type { InlineMath } from 'mdast-util-math';
import type { Nodes, Parent, PhrasingContent, Root, RootContent } from 'mdast';
import type { Typeset } from '../../src/core/claims/api.ts';
import type { NodeAction } from './extract.ts';

export function fillTree(tree: Root, actions: ReadonlyMap<Nodes, NodeAction>, fills: readonly (Typeset | undefined)[], figures: readonly (string | undefined)[]): void {
  rewriteChildren(tree, actions, fills, figures);
}

function rewriteChildren(parent: Parent, actions: ReadonlyMap<Nodes, NodeAction>, fills: readonly (Typeset | undefined)[], figures: readonly (string | undefined)[]): void {
  const out: RootContent[] = [];
  for (const child of parent.children as RootContent[]) {
    if ('children' in child) rewriteChildren(child, actions, fills, figures);
    const action = actions.get(child);
    if (!action) {
      out.push(child);
    } else if (action.kind === 'figure') {
      // Raw HTML, as in the built text: a pipeline shows it with remark-rehype's allowDangerousHtml and rehype-raw.
      const figure = figures[action.figure];
      out.push(figure === undefined ? child : ({ type: 'html', value: figure } as RootContent));
    } else if (action.kind === 'unwrap') {
      out.push(...((child as Parent).children as RootContent[]));
    } else {
      const value = fills[action.fill];
      if (value === undefined) out.push(child);
      else if (child.type === 'tableCell') {
        child.children = typesetPhrasing(value);
        out.push(child);
      } else out.push(...typesetPhrasing(value));
    }
  }
  parent.children = out as Parent['children'];
}

/** Typeset value → phrasing nodes, the way remark-math would have parsed `$…$`. */
export function typesetPhrasing(value: Typeset): PhrasingContent[] {
  if (value.kind === 'math') return [inlineMath(value.latex)];
  const nodes: PhrasingContent[] = [];
  const mathSpan = /\$([^$]+)\$/g;
  let at = 0;
  for (let m = mathSpan.exec(value.text); m !== null; m = mathSpan.exec(value.text)) {
    if (m.index > at) nodes.push({ type: 'text', value: value.text.slice(at, m.index) });
    nodes.push(inlineMath(m[1]!));
    at = m.index + m[0].length;
  }
  if (at < value.text.length) nodes.push({ type: 'text', value: value.text.slice(at) });
  return nodes;
}

function inlineMath(latex: string): InlineMath {
  return {
    type: 'inlineMath',
    value: latex,
    data: { hName: 'code', hProperties: { className: ['language-math', 'math-inline'] }, hChildren: [{ type: 'text', value: latex }] },
  };
}
