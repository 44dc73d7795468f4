/** The signature σ, in the declared sign. */
import type { Invariant } from '../registry/types.ts';
import { classicalFill, judgeClassicalClaim } from '../../claims/classical-claims.ts';
import { signatureInConvention } from '../classical/signature.ts';

export const signatureInvariant: Invariant = {
  id: 'signature',
  doc: 'The signature σ of V + Vᵀ for a Seifert matrix V, checked against Goeritz matrices with the Gordon–Litherland correction; its sign is declared (σ(positive trefoil) = −2 by default).',
  cost: 'polynomial',
  conventions: ['signature'],
  claims: [
    {
      key: 'signature',
      noun: 'signature',
      aliases: ['σ', 'σ(K)', 'σ(L)', '\\sigma', '\\sigma(K)'],
      valueDoc: 'an integer in the declared sign convention',
      example: '-2',
      changedBy: ['chirality', 'summand-chirality'],
      judge: (text, report, ctx) => judgeClassicalClaim('signature', text, report, ctx),
    },
  ],
  fills: [{ key: 'signature', valueDoc: 'σ in the declared sign', typeset: (report, convention) => classicalFill('signature', report, convention) }],
  json: [
    { field: 'signature', example: -2, value: (r, convention) => signatureInConvention(r.classical.signature, convention.signatureSign) },
    { field: 'signatureSign', example: 'negative', value: (_r, convention) => convention.signatureSign },
  ],
  tests: ['test/classical/signature.test.ts', 'test/classical/families.test.ts'],
};
