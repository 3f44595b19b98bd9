/** The kinds of plan units, their geometry family, label and our own map palette (DESIGN.md). */

export const AREA_KINDS = [
  'food-plot',
  'cover-planting',
  'timber',
  'bedding-area',
  'sanctuary',
  'water',
  'other-area',
] as const;
export const LINE_KINDS = ['access-route', 'firebreak', 'fence'] as const;
export const POINT_KINDS = ['stand-site', 'camera-site', 'mock-scrape', 'water-source', 'gate'] as const;
export const UNIT_KINDS = [...AREA_KINDS, ...LINE_KINDS, ...POINT_KINDS] as const;

export type AreaKind = (typeof AREA_KINDS)[number];
export type LineKind = (typeof LINE_KINDS)[number];
export type PointKind = (typeof POINT_KINDS)[number];
export type UnitKind = (typeof UNIT_KINDS)[number];
export type KindFamily = 'area' | 'line' | 'point';

export type PointSymbol = 'triangle' | 'square' | 'diamond' | 'circle' | 'bar';
export type LineDash = 'solid' | 'dashed' | 'dotted';

export interface KindStyle {
  kind: UnitKind;
  family: KindFamily;
  label: string;
  /** Fill colour for areas and point symbols. */
  fill: string;
  /** Stroke colour for outlines and lines. */
  stroke: string;
  fillOpacity: number;
  dash: LineDash;
  symbol?: PointSymbol;
}

const INK = '#1F2A24';
const SLATE = '#5B6770';
const MOSS_DEEP = '#2E5029';
const CLAY = '#B5562B';
const SKY = '#3C7A9E';

export const KIND_STYLES: Record<UnitKind, KindStyle> = {
  'food-plot': { kind: 'food-plot', family: 'area', label: 'Food plot', fill: '#8DB255', stroke: '#4F7A28', fillOpacity: 0.55, dash: 'solid' },
  'cover-planting': { kind: 'cover-planting', family: 'area', label: 'Cover planting', fill: '#D8B75A', stroke: '#9C7B21', fillOpacity: 0.55, dash: 'solid' },
  timber: { kind: 'timber', family: 'area', label: 'Timber', fill: '#4E7D5B', stroke: '#2C4F37', fillOpacity: 0.5, dash: 'solid' },
  'bedding-area': { kind: 'bedding-area', family: 'area', label: 'Bedding area', fill: '#A88B5E', stroke: '#6F5533', fillOpacity: 0.35, dash: 'solid' },
  sanctuary: { kind: 'sanctuary', family: 'area', label: 'Sanctuary', fill: '#C9826B', stroke: '#8E3F2A', fillOpacity: 0.2, dash: 'dashed' },
  water: { kind: 'water', family: 'area', label: 'Water', fill: '#7FB3CF', stroke: '#2F6E91', fillOpacity: 0.6, dash: 'solid' },
  'other-area': { kind: 'other-area', family: 'area', label: 'Other area', fill: '#BDB8AA', stroke: '#7B776C', fillOpacity: 0.5, dash: 'solid' },
  'access-route': { kind: 'access-route', family: 'line', label: 'Access route', fill: '#6B4F2A', stroke: '#6B4F2A', fillOpacity: 1, dash: 'dashed' },
  firebreak: { kind: 'firebreak', family: 'line', label: 'Firebreak / trail', fill: CLAY, stroke: CLAY, fillOpacity: 1, dash: 'dotted' },
  fence: { kind: 'fence', family: 'line', label: 'Fence or edge', fill: SLATE, stroke: SLATE, fillOpacity: 1, dash: 'solid' },
  'stand-site': { kind: 'stand-site', family: 'point', label: 'Stand site', fill: MOSS_DEEP, stroke: '#FFFDF7', fillOpacity: 1, dash: 'solid', symbol: 'triangle' },
  'camera-site': { kind: 'camera-site', family: 'point', label: 'Camera site', fill: SLATE, stroke: '#FFFDF7', fillOpacity: 1, dash: 'solid', symbol: 'square' },
  'mock-scrape': { kind: 'mock-scrape', family: 'point', label: 'Mock scrape', fill: CLAY, stroke: '#FFFDF7', fillOpacity: 1, dash: 'solid', symbol: 'diamond' },
  'water-source': { kind: 'water-source', family: 'point', label: 'Water source', fill: SKY, stroke: '#FFFDF7', fillOpacity: 1, dash: 'solid', symbol: 'circle' },
  gate: { kind: 'gate', family: 'point', label: 'Gate / parking', fill: INK, stroke: '#FFFDF7', fillOpacity: 1, dash: 'solid', symbol: 'bar' },
};

/** The geometry family (area, line or point) of a unit kind. */
export function kindFamily(kind: UnitKind): KindFamily {
  return KIND_STYLES[kind].family;
}

/** True when the string is one of the unit kind slugs. */
export function isUnitKind(value: string): value is UnitKind {
  return (UNIT_KINDS as readonly string[]).includes(value);
}

/** Kinds of stand at a stand site (a tree stand is climbed and needs a full-body harness from the ground up). */
export const STAND_TYPES = ['ladder', 'hang-on', 'climber', 'tripod', 'box-blind', 'ground-blind'] as const;
export type StandType = (typeof STAND_TYPES)[number];
/** Stand types climbed into a tree or onto a platform. */
export const ELEVATED_STAND_TYPES: readonly StandType[] = ['ladder', 'hang-on', 'climber', 'tripod', 'box-blind'];
