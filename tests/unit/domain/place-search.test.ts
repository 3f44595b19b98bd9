import { describe, expect, it } from 'vitest';
import { fold, rankPlaces, readQuery, type IndexedPlace } from '../../../shared/domain/place-search';

const place = (name: string, kind: 'county' | 'town', state: string, stateName: string, key: string): IndexedPlace => ({ name, kind, center: [0, 0], key, state, stateName });

describe('place search', () => {
  it('folds case, accents and punctuation', () => {
    expect(fold('  CAÑON  City!! ')).toBe('canon city');
    expect(fold('Española')).toBe('espanola');
    expect(fold('\u0000!!!')).toBe('');
  });

  it('reads a county with or without a comma, and a state by name', () => {
    expect(readQuery('Crawford County, WI')).toEqual({ name: 'crawford', state: 'wi', wantsCounty: true });
    expect(readQuery('crawford county wi')).toEqual({ name: 'crawford', state: 'wi', wantsCounty: true });
    expect(readQuery('Madison, Wisconsin')).toEqual({ name: 'madison', state: 'wisconsin', wantsCounty: false });
  });

  it('ranks exact names before prefixes before word prefixes, and counties first when asked for', () => {
    const index = [
      place('Crawfordsville, IN', 'town', 'in', 'indiana', 'crawfordsville'),
      place('Crawford, GA', 'town', 'ga', 'georgia', 'crawford'),
      place('Crawford County, WI', 'county', 'wi', 'wisconsin', 'crawford'),
      place('Port Crawford, TX', 'town', 'tx', 'texas', 'port crawford'),
    ];
    expect(rankPlaces(index, 'crawford').map((p) => p.name)).toEqual(['Crawford, GA', 'Crawford County, WI', 'Crawfordsville, IN', 'Port Crawford, TX']);
    expect(rankPlaces(index, 'crawford county')[0]!.name).toBe('Crawford County, WI');
    expect(rankPlaces(index, 'crawford, wis').map((p) => p.name)).toEqual(['Crawford County, WI']);
    expect(rankPlaces(index, '!!!')).toEqual([]);
  });
});
