/**
 * Figures drawn from the diagram that is checked: drawDiagram lays it out
 * (circle packing of its planar map) and figureSvg / figureTikz print it.
 */
export { drawDiagram, COMPONENT_COLOURS, type Drawing, type DrawnComponent, type DrawnCrossing, type Arrowhead, type Label } from './drawing.ts';
export { LABEL_CHOICES, type FigureOptions, type LabelChoice } from './options.ts';
export { figureSvg, type FigureMeta } from './svg.ts';
export { figureTikz } from './tikz.ts';
