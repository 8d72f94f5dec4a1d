/**
 * XYZ tile numbers covering a box (the Web Mercator "slippy map" scheme: n = 2^z tiles per axis,
 * x = floor((lon + 180) / 360 * n), y = floor((1 - asinh(tan φ) / π) / 2 * n)), lowest zoom first,
 * stopping at `max` tiles.
 */
export function tilesForBox(box: { west: number; south: number; east: number; north: number }, zooms: number[], max: number): { z: number; x: number; y: number }[] {
  const out: { z: number; x: number; y: number }[] = [];
  const tx = (lon: number, n: number) => Math.min(n - 1, Math.max(0, Math.floor(((lon + 180) / 360) * n)));
  const ty = (lat: number, n: number) => {
    const phi = (lat * Math.PI) / 180;
    return Math.min(n - 1, Math.max(0, Math.floor(((1 - Math.asinh(Math.tan(phi)) / Math.PI) / 2) * n)));
  };
  for (const z of zooms) {
    const n = 2 ** z;
    for (let x = tx(box.west, n); x <= tx(box.east, n); x++) {
      for (let y = ty(box.north, n); y <= ty(box.south, n); y++) {
        if (out.length >= max) return out;
        out.push({ z, x, y });
      }
    }
  }
  return out;
}

/** A tile URL from an XYZ template ({s} becomes "a"). */
export function tileUrl(template: string, t: { z: number; x: number; y: number }): string {
  return template.replace('{s}', 'a').replace('{z}', String(t.z)).replace('{x}', String(t.x)).replace('{y}', String(t.y)).replace('{r}', '');
}
