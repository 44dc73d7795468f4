/**
 * The quantities the result store keeps, each with its codec. Every one is a
 * function of the diagram up to relabelling (./canonical.ts) and of nothing
 * else (no convention, notation, family marking or limit), except the
 * boundary width, the crossing-number bounds and the simplified diagram, which
 * are keyed by the diagram as numbered with its notation and family marking.
 * Not stored: cheap values read off the diagram; the braid index bounds (they read the notation) and the Arf
 * invariant (both are cheap once the stored polynomials are known).
 */
import { bigintCodec, crossingBoundsCodec, integerCodec, khovanovCodec, laurent2Codec, laurentCodec, simplificationCodec } from './codecs.ts';

export const STORED = {
  bracket: laurentCodec('bracket/1'),
  // The widest boundary of the bracket engine's contraction depends on the crossing order its heuristic picks
  // from the numbering, so it is keyed by the diagram as numbered (a relabelled code computes it again).
  boundaryWidth: integerCodec('boundary-width/1', true),
  alexander: laurentCodec('alexander/1'),
  conway: laurentCodec('conway/1'),
  determinant: bigintCodec('determinant/1'),
  signature: integerCodec('signature/1'),
  khovanov: khovanovCodec('khovanov/1'),
  homfly: laurent2Codec('homfly/1'),
  kauffman: laurent2Codec('kauffman/1'),
  dubrovnik: laurent2Codec('dubrovnik/1'),
  // The bounds' reasons rest on theorems about the family a diagram was built as, and the simplifier's moves
  // follow the numbering: both are keyed by the labelled diagram with its notation and family marking.
  crossingNumber: crossingBoundsCodec('crossing-number/1'),
  simplified: simplificationCodec('simplified/1'),
} as const;
