/**
 * The registry of invariants: one line per registered module. The order here
 * is the order of keys in messages, in the README key table and of fields in
 * `compute --json`. Everything else (claim keys, fill keys, table-header
 * aliases, judging, typesetting, JSON) is looked up here.
 */
import type { ClaimSpec, FillSpec, Invariant } from './types.ts';
import { jonesInvariant } from '../registered/jones.ts';
import { bracketInvariant } from '../registered/bracket.ts';
import { spanInvariant } from '../registered/span.ts';
import { bracketSpanInvariant } from '../registered/bracket-span.ts';
import { minDegreeInvariant } from '../registered/min-degree.ts';
import { maxDegreeInvariant } from '../registered/max-degree.ts';
import { writheInvariant } from '../registered/writhe.ts';
import { crossingsInvariant } from '../registered/crossings.ts';
import { componentsInvariant } from '../registered/components.ts';
import { linkingInvariant } from '../registered/linking.ts';
import { alternatingInvariant } from '../registered/alternating.ts';
import { reducedInvariant } from '../registered/reduced.ts';
import { adequateInvariant } from '../registered/adequate.ts';
import { crossingNumberInvariant } from '../registered/crossing-number.ts';
import { alexanderInvariant } from '../registered/alexander.ts';
import { conwayInvariant } from '../registered/conway.ts';
import { determinantInvariant } from '../registered/determinant.ts';
import { signatureInvariant } from '../registered/signature.ts';
import { genusInvariant } from '../registered/genus.ts';
import { khovanovInvariant } from '../registered/khovanov.ts';
import { homflyInvariant } from '../registered/homfly.ts';
import { kauffmanInvariant } from '../registered/kauffman.ts';
import { braidIndexInvariant } from '../registered/braid-index.ts';
import { arfInvariant } from '../registered/arf.ts';

export type * from './types.ts';

export const INVARIANTS: readonly Invariant[] = [
  jonesInvariant,
  bracketInvariant,
  spanInvariant,
  bracketSpanInvariant,
  minDegreeInvariant,
  maxDegreeInvariant,
  writheInvariant,
  crossingsInvariant,
  componentsInvariant,
  linkingInvariant,
  alternatingInvariant,
  reducedInvariant,
  adequateInvariant,
  crossingNumberInvariant,
  alexanderInvariant,
  conwayInvariant,
  determinantInvariant,
  signatureInvariant,
  genusInvariant,
  khovanovInvariant,
  homflyInvariant,
  kauffmanInvariant,
  braidIndexInvariant,
  arfInvariant,
];

const claimSpecs = new Map<string, ClaimSpec>();
const fillSpecs = new Map<string, FillSpec>();
const ownerOfKey = new Map<string, Invariant>();
const aliases = new Map<string, string>();

/** Header text compared for aliases: lower case, outer space and `$…$` delimiters removed, inner spaces single. */
export function headerForm(header: string): string {
  return header
    .trim()
    .replace(/^\$+([^$]*)\$+$/, '$1')
    .trim()
    .replace(/\s+/g, ' ')
    .toLowerCase();
}

for (const invariant of INVARIANTS) {
  for (const spec of invariant.claims) {
    if (claimSpecs.has(spec.key)) throw new Error(`registry: claim key \`${spec.key}\` is registered twice`);
    claimSpecs.set(spec.key, spec);
    ownerOfKey.set(spec.key, invariant);
  }
  for (const spec of invariant.fills) {
    if (fillSpecs.has(spec.key)) throw new Error(`registry: fill key \`${spec.key}\` is registered twice`);
    fillSpecs.set(spec.key, spec);
    if (!ownerOfKey.has(spec.key)) ownerOfKey.set(spec.key, invariant);
  }
}
for (const spec of claimSpecs.values()) {
  for (const alias of [spec.key, ...(spec.aliases ?? [])]) {
    const form = headerForm(alias);
    const taken = aliases.get(form);
    if (taken !== undefined && taken !== spec.key) throw new Error(`registry: alias \`${alias}\` names both \`${taken}\` and \`${spec.key}\``);
    aliases.set(form, spec.key);
  }
}

/** Every claim key, in registry order. */
export const CLAIM_KEYS: readonly string[] = [...claimSpecs.keys()];
/** Every fill key, in registry order. */
export const FILL_KEYS: readonly string[] = [...fillSpecs.keys()];

export function claimSpec(key: string): ClaimSpec | undefined {
  return claimSpecs.get(key);
}

export function fillSpec(key: string): FillSpec | undefined {
  return fillSpecs.get(key);
}

/** The registered invariant that declares a claim or fill key. */
export function invariantOfKey(key: string): Invariant | undefined {
  return ownerOfKey.get(key);
}

/** The claim key a table header means (the key itself or one of its aliases), if any. */
export function claimKeyForHeader(header: string): string | undefined {
  return aliases.get(headerForm(header));
}
