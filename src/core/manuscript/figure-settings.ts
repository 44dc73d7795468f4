/**
 * The settings of a figure as a manuscript writes them (`size=6cm`, `arrows=yes`, `labels=crossings`, …),
 * read into the drawing core's FigureOptions. Both front ends hand their `key=value` pairs here, so the
 * Markdown and LaTeX syntax accept the same settings and give the same messages.
 */
import type { Diagnostic } from '../diagnostics/diagnostic.ts';
import type { FigureOptions } from '../drawing/index.ts';
import type { Locator } from './api.ts';

export const FIGURE_OPTION_INVALID = 'figure-option-invalid';

/** One `key=value` of a figure, as written, with the places of its key and its value. */
export interface FigureSetting {
  readonly key: string;
  readonly value: string;
  readonly locateKey: Locator;
  readonly locateValue: Locator;
}

/** A length unit and its size in big points (1/72 in): lengths are read in bp and converted for each output (drawFigure). */
const LENGTH_UNITS: Readonly<Record<string, number>> = {
  bp: 1,
  pt: 72 / 72.27, // TeX's point
  px: 0.75, // CSS: 96 px to the inch
  mm: 72 / 25.4,
  cm: 72 / 2.54,
  in: 72,
};
const UNIT_LIST = Object.keys(LENGTH_UNITS).join(', ');

const YES = ['yes', 'true', 'on'];
const NO = ['no', 'false', 'off'];
const LABELS = ['none', 'crossings', 'edges', 'both'] as const;

type Reader = (value: string) => { readonly value: FigureOptions[keyof FigureOptions] } | { readonly problem: string };

/**
 * The smallest and largest lengths (in bp) taken: a figure below 20bp shows nothing, and the drawing takes
 * at most 10,000 of its units (px or pt) on its longer side.
 */
const LENGTH_RANGES: Readonly<Record<string, readonly [number, number]>> = {
  size: [20, 5000],
  'line-width': [0.05, 50],
  gap: [0, 100],
};

const SETTINGS: Readonly<Record<string, { readonly field: keyof FigureOptions; readonly read: Reader; readonly example: string }>> = {
  size: { field: 'size', read: length('size'), example: 'size=6cm' },
  'line-width': { field: 'lineWidth', read: length('line-width'), example: 'line-width=1.2pt' },
  gap: { field: 'gap', read: length('gap'), example: 'gap=4pt' },
  arrows: { field: 'arrows', read: yesNo, example: 'arrows=yes' },
  colours: { field: 'colours', read: yesNo, example: 'colours=yes' },
  labels: { field: 'labels', read: labels, example: 'labels=crossings' },
  'outer-face': { field: 'outerFace', read: edgeNumber, example: 'outer-face=2' },
};

/** The setting names, in the order the README lists them. */
export const FIGURE_SETTING_NAMES: readonly string[] = Object.keys(SETTINGS);

/** Names an author may reach for that mean one of ours. */
const NEAR_NAMES: Readonly<Record<string, string>> = { colors: 'colours', color: 'colours', colour: 'colours', width: 'size', linewidth: 'line-width', 'outer': 'outer-face', label: 'labels', arrow: 'arrows' };

/**
 * Reads every setting; a bad one is a located error and is left out, so the others still apply and every
 * mistake is reported in one run. `where` names the markup in messages (`::drawing`, `\skeindrawing`).
 */
export function readFigureSettings(settings: readonly FigureSetting[], where: string): { options: FigureOptions; diagnostics: Diagnostic[] } {
  const options: Record<string, unknown> = {};
  const diagnostics: Diagnostic[] = [];
  const seen = new Set<string>();
  const problem = (message: string, locate: Locator, hint: string): void => {
    diagnostics.push({ severity: 'error', ruleId: FIGURE_OPTION_INVALID, message: `${where}: ${message}`, location: locate(), hints: [hint] });
  };
  for (const s of settings) {
    const spec = SETTINGS[s.key];
    if (!spec) {
      const near = NEAR_NAMES[s.key.toLowerCase()] ?? (SETTINGS[s.key.toLowerCase()] ? s.key.toLowerCase() : undefined);
      problem(`\`${s.key}\` is not a figure setting: the settings are ${FIGURE_SETTING_NAMES.join(', ')}`, s.locateKey, near ? `Did you mean \`${near}\`?` : 'Remove it, or write one of the settings the README lists under figures.');
      continue;
    }
    if (seen.has(s.key)) {
      problem(`\`${s.key}\` is given twice`, s.locateKey, 'Keep one of them.');
      continue;
    }
    seen.add(s.key);
    const read = spec.read(s.value.trim());
    if ('problem' in read) problem(read.problem, s.locateValue, `Write it as in ${spec.example}.`);
    else options[spec.field] = read.value;
  }
  // Strokes and gaps are measured against the figure (the drawing's own bounds, said in the author's units here).
  const size = (options['size'] as number | undefined) ?? DEFAULT_SIZE_BP;
  for (const [key, field, fraction, what] of [['line-width', 'lineWidth', 10, 'a tenth'], ['gap', 'gap', 5, 'a fifth']] as const) {
    const value = options[field] as number | undefined;
    if (value === undefined || value <= size / fraction) continue;
    const setting = settings.filter((x) => x.key === key).at(-1)!;
    problem(`${key}=${setting.value} is more than ${what} of the figure's size (${sizeText(settings)}), so the strokes would fill it`, setting.locateValue, `Make ${key} smaller, or the figure larger.`);
    delete options[field];
  }
  return { options: options as FigureOptions, diagnostics };
}

/** The drawing's default size (240, px in SVG and pt in TikZ), in bp as SVG shows it. */
const DEFAULT_SIZE_BP = 180;

function sizeText(settings: readonly FigureSetting[]): string {
  const written = settings.find((x) => x.key === 'size');
  return written ? `size=${written.value}` : 'the default, 240px';
}

function length(key: string): Reader {
  const [least, most] = LENGTH_RANGES[key]!;
  return (value) => {
    const m = /^(\d+(?:\.\d+)?|\.\d+)\s*([a-z]*)$/i.exec(value);
    if (!m) return { problem: `${key}=${value} is not a length: write a number and a unit (${UNIT_LIST})` };
    const unit = m[2]!.toLowerCase();
    if (unit === '') return { problem: `${key}=${value} has no unit: write one of ${UNIT_LIST} after the number` };
    const factor = LENGTH_UNITS[unit];
    if (factor === undefined) return { problem: `${key}=${value}: \`${m[2]}\` is not a unit skeinproof knows; write one of ${UNIT_LIST}` };
    const bp = Number(m[1]) * factor;
    if (bp < least || bp > most) return { problem: `${key}=${value} is out of range: it must be between ${least}bp and ${most}bp (${shown(least / LENGTH_UNITS['mm']!)}mm to ${shown(most / LENGTH_UNITS['mm']!)}mm)` };
    return { value: Math.round(bp * 1000) / 1000 };
  };
}

function yesNo(value: string): ReturnType<Reader> {
  const v = value.toLowerCase();
  if (YES.includes(v)) return { value: true };
  if (NO.includes(v)) return { value: false };
  return { problem: `\`${value}\` is not yes or no (also true/false, on/off)` };
}

function labels(value: string): ReturnType<Reader> {
  const v = value.toLowerCase();
  return (LABELS as readonly string[]).includes(v) ? { value: v as FigureOptions['labels'] } : { problem: `labels=${value}: write one of ${LABELS.join(', ')}` };
}

/** The outer face is named by an edge on its boundary (the face on the edge's left), numbered from 1 as labels=edges shows them. */
function edgeNumber(value: string): ReturnType<Reader> {
  if (!/^\d+$/.test(value) || Number(value) < 1) return { problem: `outer-face=${value} is not an edge number: write the number of an edge (from 1, as labels=edges shows them) whose left side is to be outside` };
  return { value: Number(value) };
}

function shown(x: number): string {
  return String(Math.round(x * 100) / 100);
}
