import { describe, expect, it } from 'vitest';
import { coordinatesText, directionsLink, platformOf } from '../../../../src/features/field/lib/directions';

// User agents as the phones send them (from memory; their shape is documented by each vendor).
const IPHONE = 'Mozilla/5.0 (iPhone; CPU iPhone OS 17_5 like Mac OS X) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/17.5 Mobile/15E148 Safari/604.1';
const IPAD_AS_MAC = 'Mozilla/5.0 (Macintosh; Intel Mac OS X 10_15_7) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/17.5 Safari/605.1.15';
const ANDROID = 'Mozilla/5.0 (Linux; Android 14; Pixel 8) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/126.0.0.0 Mobile Safari/537.36';
const DESKTOP = 'Mozilla/5.0 (X11; Linux x86_64) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/126.0.0.0 Safari/537.36';

// Bluestem Ridge's Club plot, near 43.5494° N, 90.8785° W (demo data), as [lon, lat].
const PLOT: [number, number] = [-90.8785, 43.5494];

describe('which phone', () => {
  it('tells iPhones (and iPads that report a Mac, by touch) from Android and the rest', () => {
    expect(platformOf(IPHONE)).toBe('ios');
    expect(platformOf(IPAD_AS_MAC, 5)).toBe('ios');
    expect(platformOf(IPAD_AS_MAC, 0)).toBe('other');
    expect(platformOf(ANDROID)).toBe('android');
    expect(platformOf(DESKTOP)).toBe('other');
  });
});

describe('"Open in maps"', () => {
  it('gives an iPhone an Apple Maps link with the destination, latitude first', () => {
    // Apple's "Map Links" (URL scheme reference): daddr = destination, dirflg=d = driving (from memory).
    expect(directionsLink(PLOT, 'Club plot', 'ios')).toBe('https://maps.apple.com/?daddr=43.5494,-90.8785&dirflg=d&q=Club%20plot');
  });

  it('gives Android the geo URI (RFC 5870, latitude first) — the link that did nothing on an iPhone', () => {
    expect(directionsLink(PLOT, 'Club plot', 'android')).toBe('geo:43.5494,-90.8785?q=43.5494,-90.8785(Club%20plot)');
    expect(directionsLink(PLOT, undefined, 'other')).toBe('geo:43.5494,-90.8785');
  });

  it('has no link without a position, or with one off the Earth', () => {
    expect(directionsLink(null, 'x', 'ios')).toBeNull();
    expect(directionsLink([10, 95], 'x', 'ios')).toBeNull();
    expect(directionsLink([Number.NaN, 40], 'x', 'android')).toBeNull();
  });

  it('offers the coordinates to copy as "latitude, longitude" with five decimals', () => {
    expect(coordinatesText(PLOT)).toBe('43.54940, -90.87850');
    expect(coordinatesText(null)).toBeNull();
  });
});
