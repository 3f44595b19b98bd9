/** What becomes of each feature found in an imported file: the boundary, a unit of some kind, or nothing. */
import type { Geometry, MultiPolygon, Polygon, Position } from 'geojson';
import { closeTrack } from '../../../../shared/domain/track-closing';
import { AREA_KINDS, KIND_STYLES, LINE_KINDS, POINT_KINDS, type KindFamily, type UnitKind } from '../../../../shared/domain/unit-kinds';
import { LIMITS } from '../../../../shared/limits';
import type { UnitCreateInput } from '../../../../shared/schemas/unit';

export type ImportChoice = 'skip' | 'boundary' | UnitKind;

/** The kind an imported feature gets when its file states none. */
export const DEFAULT_KIND_BY_FAMILY: Record<KindFamily, UnitKind> = { area: 'other-area', line: 'access-route', point: 'stand-site' };

/** A feature as the import preview lists it. */
export interface ImportCandidate {
  name: string;
  family: KindFamily;
  kind?: UnitKind;
  geometry: Geometry;
  /** Set on an open line whose ends lie close enough to be closed into an area (metres apart). */
  closableGapM?: number;
}

const BOUNDARY_WORDS = /\b(boundary|property line|parcel|outline)\b/i;

/**
 * The choice offered first for a feature: the kind the file states; else the boundary for an area
 * named like one ("Property boundary", "Parcel 12"); else the default kind of its family.
 */
export function defaultImportChoice(feature: ImportCandidate): ImportChoice {
  if (feature.kind && KIND_STYLES[feature.kind]?.family === feature.family) return feature.kind;
  if (feature.family === 'area' && BOUNDARY_WORDS.test(feature.name)) return 'boundary';
  return DEFAULT_KIND_BY_FAMILY[feature.family];
}

/** The choices that fit a feature's family, in the order the picker lists them; a closable track may also become an area. */
export function choicesFor(family: KindFamily, closable = false): ImportChoice[] {
  if (family === 'area') return ['boundary', ...AREA_KINDS, 'skip'];
  if (family === 'line') return closable ? [...LINE_KINDS, 'boundary', ...AREA_KINDS, 'skip'] : [...LINE_KINDS, 'skip'];
  return [...POINT_KINDS, 'skip'];
}

/** The label of a choice in the picker. */
export function choiceLabel(choice: ImportChoice): string {
  if (choice === 'skip') return 'Skip';
  if (choice === 'boundary') return 'Property boundary';
  return KIND_STYLES[choice].label;
}

export interface ImportSavePlan {
  /** The new boundary, or null when no feature was chosen for it. */
  boundary: Polygon | MultiPolygon | null;
  units: UnitCreateInput[];
  /** Choices that cannot be saved, said so that the person can change them. */
  problems: string[];
}

/**
 * Turns the choices into what to save: the features chosen as the boundary joined into one
 * Polygon or MultiPolygon, and one new unit per feature given a kind of its family.
 */
export function planImportSave(features: readonly ImportCandidate[], choices: readonly ImportChoice[]): ImportSavePlan {
  const rings: Position[][][] = [];
  const units: UnitCreateInput[] = [];
  const problems: string[] = [];
  features.forEach((original, i) => {
    const choice = choices[i] ?? 'skip';
    const label = original.name.trim() || `Feature ${i + 1}`;
    if (choice === 'skip') return;
    // A walked track with its ends close together, chosen as an area: join its ends.
    const wantsArea = choice === 'boundary' || KIND_STYLES[choice]?.family === 'area';
    const f: ImportCandidate =
      wantsArea && original.family === 'line' && original.closableGapM !== undefined && original.geometry.type === 'LineString'
        ? { ...original, family: 'area', geometry: closeTrack(original.geometry) }
        : original;
    if (choice === 'boundary') {
      if (f.geometry.type === 'Polygon') rings.push(f.geometry.coordinates);
      else if (f.geometry.type === 'MultiPolygon') rings.push(...f.geometry.coordinates);
      else problems.push(`“${label}” is a ${f.family}, so it cannot be the property boundary: choose a kind of ${f.family} or Skip.`);
      return;
    }
    const style = KIND_STYLES[choice];
    if (!style || style.family !== f.family) {
      problems.push(`“${label}” is a ${f.family}, not a ${style?.family ?? 'known shape'}: choose one of the ${f.family} kinds or Skip.`);
      return;
    }
    units.push({ kind: choice, name: label.slice(0, LIMITS.nameMax), geometry: f.geometry });
  });
  const boundary: Polygon | MultiPolygon | null =
    rings.length === 0 ? null : rings.length === 1 ? { type: 'Polygon', coordinates: rings[0] } : { type: 'MultiPolygon', coordinates: rings };
  return { boundary, units, problems };
}
