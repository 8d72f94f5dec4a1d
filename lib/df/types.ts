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

/** Result of {@link estimateFix}. */
export type Fix =
  | {
      ok: true;
      lat: number;
      lon: number;
      ellipse: Ellipse;
      residuals: { id?: string; offsetDeg: number; sigmas: number }[];
      /** Lines inconsistent with the rest, named by `id ?? String(index)`. */
      outlierIds: string[];
      /** Present when outlierIds is not empty. */
      withoutOutliers?: { lat: number; lon: number; ellipse: Ellipse };
      intersections: { lat: number; lon: number; ids: [string | undefined, string | undefined] }[];
      warnings: string[];
    }
  | { ok: false; reason: 'too-few-lines' | 'near-parallel' | 'invalid-input' | 'no-convergence'; message: string };

/** Options of {@link estimateFix}. */
export type FixOptions = { confidence?: number };

/** Result of {@link fitNullSweep}. */
export type NullSweepFit =
  | { ok: true; nullAzimuthDeg: number; sigmaDeg: number; nullDepthDb: number; rmsResidualDb: number }
  | { ok: false; reason: string; message: string };

/** One reading of a rotation sweep: loop axis azimuth (degrees) and level (dBm). */
export type SweepSample = { azimuthDeg: number; levelDbm: number };

/** A suggested spot to take the next bearing from. */
export type NextSpot = { lat: number; lon: number; expectedSemiMajorM: number };

/** Options of {@link suggestNextSpots}: ring radii in metres, number of spots wanted. */
export type NextSpotOptions = { minRangeM?: number; maxRangeM?: number; count?: number };
