import type { Material, Practice, ServiceRateEntry } from '../models';
import type { MaterialDto, MaterialKind, PracticeDto } from '../../shared/schemas/library';
import { cautionsForPractice } from '../../shared/domain/cautions';
import type { MaterialDefinition } from '../../shared/domain/practice';

/** The API kind of a domain material type. */
export function materialKind(type: MaterialDefinition['type']): MaterialKind {
  if (type === 'adjuvant') return 'herbicide';
  if (type === 'item') return 'other';
  return type;
}

export function presentMaterial(m: Material): MaterialDto {
  return { ...m.definition, key: m.key, name: m.name, id: m.id, kind: materialKind(m.definition.type), archived: m.archived, updatedAt: m.updatedAt.toISOString() } as MaterialDto;
}

export function presentRate(r: ServiceRateEntry) {
  return { ...r.definition, key: r.key, name: r.name, id: r.id, archived: r.archived, updatedAt: r.updatedAt.toISOString() };
}

export function presentPractice(p: Practice, materials: readonly MaterialDefinition[]): PracticeDto {
  return {
    ...p.definition,
    key: p.key,
    name: p.name,
    id: p.id,
    cautions: cautionsForPractice(p.definition, materials).map((c) => ({ id: c.id, title: c.title, text: c.text })),
    updatedAt: p.updatedAt.toISOString(),
  };
}
