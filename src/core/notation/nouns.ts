/** What each notation's code is called in prose (captions, figure descriptions). */
import type { Notation } from '../diagram/model.ts';

export const NOTATION_NOUNS: Readonly<Record<Notation, string>> = { pd: 'PD code', dt: 'DT code', gauss: 'Gauss code', braid: 'braid word', family: 'family code' };
