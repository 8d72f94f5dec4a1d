/**
 * Shared types of the bearing-math library. Angles are in degrees, distances in metres,
 * positions are WGS84 geodetic latitude/longitude in degrees.
 */

/** One null bearing taken from one spot. */
export type LineOfBearing = {
  id?: string;
  /** Observer latitude, WGS84 degrees. */
  lat: number;
  /** Observer longitude, WGS84 degrees. */
  lon: number;
  /** Bearing in degrees clockwise from TRUE north; any finite number (normalised internally). */
  azimuthDeg: number;
  /** 1-sigma bearing error in degrees; default 3. */
  sigmaDeg?: number;
  /**
   * true: the source lies toward azimuthDeg only (sense antenna used);
   * default false: a loop null is a line through the observer, both ways.
   */
  oneWay?: boolean;
};

/** Error ellipse: semi-axes in metres, major-axis azimuth in degrees clockwise from true north, [0,180). */
export type Ellipse = { semiMajorM: number; semiMinorM: number; majorAxisAzimuthDeg: number; confidence: number };

/** A position with its error ellipse. */
export type FixEstimate = { lat: number; lon: number; ellipse: Ellipse };

/** What a notice is about (stable codes for the app; the message is the plain sentence). */
export type FixNoticeCode =
  /** The lines disagree more than their sigmas allow; the ellipse was widened by the variance factor. */
  | 'lines-disagree'
  /** Some line is wrong but the lines cannot tell which: take another bearing from a new side. */
  | 'cannot-tell-which'
  /** Lines inconsistent with the rest were set aside (their ids in `ids`). */
  | 'lines-set-aside'
  /** The same bearing was entered more than once and is counted once (`ids`: the group). */
  | 'duplicate-lines'
  /** The fix lies within a few metres of an observer (`ids`: that line). */
  | 'fix-at-observer'
  /** The lines barely cross: the region reaches as far as it was traced. */
  | 'open-region'
  /** A plain note kept from a fix computed by an earlier version (no code was stored). */
  | 'note';

/** A structured warning: stable code, a plain sentence, the lines concerned. */
export type FixNotice = { code: FixNoticeCode; message: string; ids?: string[] };

/** Result of {@link estimateFix}. */
export type Fix =
  | {
      ok: true;
      /**
       * The fix the product acts on: the robust estimate, with inconsistent lines set aside
       * (outlierIds). Its ellipse is widened by the a-posteriori variance factor when the kept
       * lines disagree more than their sigmas allow, and encloses `region` when that is given.
       */
      lat: number;
      lon: number;
      ellipse: Ellipse;
      /**
       * Likelihood-ratio confidence region (closed ring of [lon, lat] pairs, GeoJSON order), given
       * when it differs visibly from the ellipse (poor geometry); the map draws it instead.
       */
      region?: [number, number][];
      /** Factor applied to the covariance (1 unless the lines disagree; then chi-square / dof). */
      varianceFactor: number;
      /** Every input line at the fix; setAside for outliers and repeated duplicates. */
      residuals: { id?: string; offsetDeg: number; sigmas: number; setAside?: boolean }[];
      /** Lines inconsistent with the rest, set aside from the fix, named by `id ?? String(index)`. */
      outlierIds: string[];
      /** The solution from all lines (duplicates counted once), present when outlierIds is not empty. */
      allLines?: FixEstimate;
      intersections: { lat: number; lon: number; ids: [string | undefined, string | undefined] }[];
      /** The notices' messages (kept for display code that wants plain strings). */
      warnings: string[];
      notices: FixNotice[];
    }
  | {
      ok: false;
      reason: 'too-few-lines' | 'near-parallel' | 'invalid-input' | 'no-convergence' | 'behind-one-way';
      message: string;
    };

/** Options of {@link estimateFix}. */
export type FixOptions = { confidence?: number };

/** Result of {@link fitNullSweep}. */
export type NullSweepFit =
  | { ok: true; nullAzimuthDeg: number; sigmaDeg: number; nullDepthDb: number; rmsResidualDb: number }
  | { ok: false; reason: string; message: string };

/** One reading of a rotation sweep: loop axis azimuth (degrees) and level (dBm). */
export type SweepSample = { azimuthDeg: number; levelDbm: number };

/** A suggested spot to take the next bearing from. */
export type NextSpot = {
  lat: number;
  lon: number;
  /** Expected 95 % semi-major after a bearing here, metres. */
  expectedSemiMajorM: number;
  /** Expected 95 % ellipse area after a bearing here, averaged over where the source may be, m^2. */
  expectedAreaM2: number;
  /** Distance from the fix, metres. */
  distanceFromFixM: number;
  /** Walking distance (straight line) from `from`, metres, when `from` was given. */
  walkM?: number;
};

/**
 * Options of {@link suggestNextSpots}: count (default 3); frequencyHz (keeps spots out of the
 * source's reactive near field); from (where the hunter stands) with maxWalkM (default 1000 m):
 * spots within that walk are preferred; maxRangeM: farthest ring from the fix (default 2000 m).
 */
export type NextSpotOptions = { count?: number; frequencyHz?: number; from?: { lat: number; lon: number }; maxWalkM?: number; maxRangeM?: number };
