// Site lists: office CSV and the app's own sites GeoJSON, previewed with per-row errors, then stored.
// The sites are invented (Wrenfold Creek demo names and made-up codes); no published values here
// except the sphere's degree length, π·R/180 with R = 6,371,008.8 m (IUGG mean radius; read).
// Source of the distance reference: IUGG mean Earth radius (read), as said above.
import { beforeEach, describe, expect, it } from 'vitest';
import { previewSiteCsv, previewSiteFile, importSites } from '../../src/exchange/site-import';
import { sitesGeoJson } from '../../src/exchange/geojson';
import { listSites, saveSite } from '../../src/store';
import { distanceM, nearestSite } from '../../src/records/geo';
import { freshDb } from '../store/helpers';

beforeEach(freshDb);

const OFFICE_CSV = [
  'Code,Name,Type,Latitude,Longitude,Datum,Run_Order',
  'WF-01,Wrenfold Creek at the upper footbridge,stream,45.50321,-110.90112,WGS84,2',
  'WF-02,Limekiln spring,spring,"45,49870",-110.89544,WGS84,1',
  ',No code here,stream,45.1,-110.1,WGS84,3',
  'WF-04,Bad latitude,stream,95.2,-110.1,WGS84,4',
  'WF-05,Mystery,volcano,,,,',
  'WF-01,Twice,stream,45.5,-110.9,WGS84,5',
  'WF-06,No datum,well,45.4,-110.8,,6',
  'WF-07,Half a position,lake,45.4,,WGS84,',
].join('\r\n');

describe('site list from the office (CSV)', () => {
  it('previews every row with its own problems and stores only the good ones', async () => {
    const p = previewSiteCsv(OFFICE_CSV, []);
    expect(p.fileErrors).toEqual([]);
    expect(p.rows.map((r) => [r.line, r.errors.length === 0])).toEqual([[2, true], [3, true], [4, false], [5, false], [6, false], [7, false], [8, false], [9, false]]);
    expect(p.rows[1]!.site).toMatchObject({ code: 'WF-02', type: 'spring', latitude: 45.4987, longitude: -110.89544, datum: 'WGS84', runOrder: 1 });
    expect(p.rows[2]!.errors).toEqual(['No site code.']);
    expect(p.rows[3]!.errors).toEqual(['Latitude 95.2 is above 90.']);
    expect(p.rows[4]!.errors).toEqual(['Site type “volcano” is not one of stream, spring, well, lake, other.']);
    expect(p.rows[5]!.errors).toEqual(['Site code WF-01 appears twice in the file.']);
    expect(p.rows[6]!.errors).toEqual(['Coordinates need their datum (e.g. WGS84, NAD83).']);
    expect(p.rows[7]!.errors).toEqual(['Give both latitude and longitude, or neither.']);
    const r = await importSites(p, 'office');
    expect(r).toEqual({ created: 2, updated: 0, skipped: 6 });
    expect((await listSites()).map((s) => [s.code, s.runOrder])).toEqual([['WF-01', 2], ['WF-02', 1]]);
  });

  it('a code already on the phone updates that site (same id) instead of adding a second', async () => {
    const old = await saveSite({ code: 'WF-01', name: 'Old name', type: 'stream', notes: 'wade from the left bank' }, 'crew');
    const p = previewSiteCsv('code,name,type,latitude,longitude,datum,run_order\r\nwf-01,New name,stream,45.5,-110.9,WGS84,3\r\n', [old]);
    expect(p.rows[0]!.action).toBe('update');
    await importSites(p, 'office');
    const [site] = await listSites();
    expect(site).toMatchObject({ id: old.id, name: 'New name', runOrder: 3, notes: 'wade from the left bank' });
  });

  it('says what is missing when the file has no code or name column', () => {
    const p = previewSiteCsv('station name,lat\r\nx,1\r\n', []);
    expect(p.rows).toEqual([]);
    expect(p.fileErrors[0]).toMatch(/needs a code and a name column/);
  });
});

describe('sites from another phone (the GeoJSON Bankside exports)', () => {
  it('reads back every site of its own export with position, type and run order', async () => {
    await saveSite({ code: 'WF-01', name: 'Upper footbridge', type: 'stream', latitude: 45.50321, longitude: -110.90112, datum: 'WGS84', accuracyM: 5, runOrder: 2 }, 'crew');
    await saveSite({ code: 'WF-02', name: 'Limekiln spring', type: 'spring', latitude: 45.4987, longitude: -110.89544, datum: 'WGS84', runOrder: 1 }, 'crew');
    await saveSite({ code: 'OLD-9', name: 'Surveyed in NAD27', type: 'well', latitude: 45.1, longitude: -110.2, datum: 'NAD27' }, 'crew');
    const exported = sitesGeoJson(await listSites());
    await freshDb();
    const p = previewSiteFile('bankside_sites.geojson', exported, []);
    expect(p.format).toBe('geojson');
    expect(p.rows.every((r) => r.errors.length === 0)).toBe(true);
    await importSites(p, 'crew');
    const back = await listSites();
    expect(back.map((s) => [s.code, s.type, s.latitude, s.longitude, s.datum, s.accuracyM, s.runOrder])).toEqual([
      // RFC 7946 has no place for a NAD27 point: it travels without a position and keeps its datum
      ['OLD-9', 'well', undefined, undefined, 'NAD27', undefined, undefined],
      ['WF-01', 'stream', 45.50321, -110.90112, 'WGS84', 5, 2],
      ['WF-02', 'spring', 45.4987, -110.89544, 'WGS84', undefined, 1],
    ]);
  });

  it('refuses a file that is not a FeatureCollection', () => {
    expect(previewSiteFile('x.geojson', '{"type":"Feature"}', []).fileErrors).toEqual(['Not a GeoJSON FeatureCollection.']);
    expect(previewSiteFile('x.json', '{oops', []).fileErrors[0]).toMatch(/^Not valid JSON/);
  });
});

describe('the site the crew stands at', () => {
  it('measures one degree of latitude as π·R/180 = 111,195 m', () => {
    expect(distanceM(45, -110, 46, -110)).toBeCloseTo(111_195.08, 1);
  });

  it('offers the nearest site only within the fix accuracy plus the site’s own', () => {
    const sites = [
      { code: 'A', latitude: 45.5, longitude: -110.9, datum: 'WGS84', accuracyM: 5 },
      { code: 'B', latitude: 45.501, longitude: -110.9, datum: 'WGS84' },
      { code: 'C', latitude: 45.50005, longitude: -110.9, datum: 'NAD27' },
    ];
    // 0.0002° of latitude ≈ 22.2 m north of A, 88.9 m south of B; C is skipped (other datum)
    const fix = { latitude: 45.5002, longitude: -110.9, accuracyM: 20 };
    const at = nearestSite(fix, sites)!;
    expect(at.site.code).toBe('A');
    expect(at.distanceM).toBeCloseTo(22.24, 1);
    expect(at.within).toBe(true); // 22.2 ≤ 20 + 5
    expect(nearestSite({ ...fix, accuracyM: 10 }, sites)!.within).toBe(false); // 22.2 > 10 + 5
  });
});
