import { describe, expect, it } from 'vitest';
import { SurveyRefused, joinByTime, readGpxTrack, readLevelCsv, strongestPoint, walkedSurvey } from '@/lib/survey/walked-survey';
import { sUnitsToDbm } from '@/lib/df';

import { gpxOf, iso, walk } from '../../support/survey';

describe('walked survey import', () => {
  it('GPX + CSV joined by time within the stated tolerance; levels too far from any point are left out', () => {
    const csv = ['time,level,unit', `${iso(21)},5,S`, `${iso(49)},8,S`, `${iso(95)},-80,dBm`, `${iso(300)},9,S`].join('\n');
    const r = walkedSurvey(gpxOf(walk), csv, 5);
    expect(r.points.map((p) => p.lat)).toEqual([walk[2].lat, walk[5].lat, walk[9].lat]);
    expect(r.points.map((p) => p.level)).toEqual([{ unit: 'S', value: 5 }, { unit: 'S', value: 8 }, { unit: 'dBm', value: -80 }]);
    expect(r.unmatched).toEqual([5]); // 300 s is 210 s after the last point
    const top = strongestPoint(r.points, (p) => (p.level.unit === 'dBm' ? p.level.value : sUnitsToDbm(p.level.value, 0, 7.1e6)));
    expect(top!.level).toEqual({ unit: 'S', value: 8 }); // S8 = -79 dBm (IARU R.1) beats -80 dBm
  });

  it('a tolerance of 0 s joins exact times only', () => {
    const track = readGpxTrack(gpxOf(walk));
    const { points, unmatched } = joinByTime(track, readLevelCsv(`time,level\n${iso(20)},4\n${iso(21)},4`), 0);
    expect(points).toHaveLength(1);
    expect(unmatched).toEqual([3]);
  });

  it('levels in a GPX extension need no CSV', () => {
    const r = walkedSurvey(gpxOf(walk.map((p, i) => ({ ...p, level: String(3 + (i % 4)) }))));
    expect(r.points).toHaveLength(10);
    expect(r.points[3].level).toEqual({ unit: 'S', value: 6 });
  });

  it('bad input names the problem and where', () => {
    expect(() => readGpxTrack('<gpx>\n<trk><trkpt lat="1" lon="2"></trk></gpx>')).toThrow(/not well-formed XML at line 2, column \d+: Opening and ending tag mismatch/);
    expect(() => readGpxTrack('<kml></kml>')).toThrow(/root element is <kml>, not <gpx>/);
    expect(() => readGpxTrack('just some text')).toThrow(SurveyRefused);
    expect(() => readLevelCsv(`time,level\n${iso(1)},5\n${iso(2)},loud`)).toThrow(/CSV row 3: the level "loud" is not a number/);
    expect(() => readLevelCsv(`time,level\nyesterday,5`)).toThrow(/CSV row 2: "yesterday" is not a time/);
    expect(() => readLevelCsv(`when,how\n1,2`)).toThrow(/needs the columns time and level/);
    expect(() => walkedSurvey(gpxOf(walk))).toThrow(/No track point carries a <level>/);
  });

  it('every bad point and row is named, not only the first, and a point without a time does not borrow the next one', () => {
    // A point lacking <time> must be refused as itself: the parser's time list skips it, so reading by index would shift the rest.
    const gpx = gpxOf(walk).replace(`<time>${iso(30)}</time>`, '');
    let refused: SurveyRefused | undefined;
    try {
      walkedSurvey(gpx, `time,level\n${iso(10)},5\n${iso(20)},loud\nnoon,4`);
    } catch (err) {
      refused = err as SurveyRefused;
    }
    expect(refused).toBeInstanceOf(SurveyRefused);
    expect(refused!.problems.map((p) => [p.file, p.line ?? p.row])).toEqual([
      ['gpx', 7],
      ['csv', 3],
      ['csv', 4],
    ]);
    expect(refused!.message).toMatch(/^Track point 4 \(line 7\) has no <time>.*\(3 problems in all\)$/);
  });
});
