'use client';

import { useState } from 'react';
import { useMapSettings } from '@/components/map/map-settings';
import { doorsUrls } from '@/components/hunt/use-doors';
import { huntDataUrls } from '@/components/hunt/use-hunt-data';
import { callApi } from '@/lib/api/client';
import { readingsUrl } from './use-level-trail';
import { tilesForBox, tileUrl } from './tile-list';

/** Half the side of the area kept around the fix, metres. */
const AREA_HALF_M = 500;

const mb = (bytes: number) => `${(bytes / 1e6).toFixed(1)} MB`;

function boxAround(p: { lat: number; lon: number }, halfM: number) {
  const dLat = halfM / 111_320;
  const dLon = halfM / (111_320 * Math.cos((p.lat * Math.PI) / 180));
  return { west: p.lon - dLon, south: p.lat - dLat, east: p.lon + dLon, north: p.lat + dLat };
}

/** Loads one image the way the map does (so the worker keeps it as a tile). */
const loadImage = (src: string) =>
  new Promise<boolean>((resolve) => {
    const img = new Image();
    img.onload = () => resolve(true);
    img.onerror = () => resolve(false);
    img.src = src;
  });

/**
 * "Prepare for the field": loads, while there is a connection, everything the hunt needs around
 * the fix (the case, its lines, fix, walk, candidates, premises and the places layer within 500 m)
 * at the very addresses the screen reads (so the service worker's copies are the ones it finds
 * offline; a places box the map asks for later is answered from the kept area, see app/sw.ts),
 * then shows the storage used on the phone. Tiles are fetched
 * ahead only when the club's tile server allows it (TILE_PREFETCH_MAX > 0), at most that many.
 */
export function PrepareArea({ caseId, centre, fixId }: { caseId: string; centre: { lat: number; lon: number } | null; fixId?: string | null }) {
  const settings = useMapSettings();
  const [state, setState] = useState<{ busy: boolean; text: string | null }>({ busy: false, text: null });

  const prepare = async () => {
    setState({ busy: true, text: 'Loading the area…' });
    const hunt = huntDataUrls(caseId);
    const doors = doorsUrls(caseId, fixId);
    const urls = [hunt.case, hunt.bearings, hunt.fix, readingsUrl(caseId)];
    if (settings.places) urls.push(doors.candidates, doors.premises);
    const box = centre ? boxAround(centre, AREA_HALF_M) : null;
    if (box && settings.places) urls.push(`/api/places?bbox=${[box.west, box.south, box.east, box.north].map((v) => v.toFixed(6)).join(',')}`);
    const answers = await Promise.all(urls.map((u) => callApi(u)));
    const failed = answers.filter((a) => !a.ok).length;
    let tiles = 0;
    if (box && settings.tileUrl && settings.tilePrefetchMax > 0) {
      const list = tilesForBox(box, [15, 16, 17, 18], settings.tilePrefetchMax);
      for (let i = 0; i < list.length; i += 4) {
        const ok = await Promise.all(list.slice(i, i + 4).map((t) => loadImage(tileUrl(settings.tileUrl, t))));
        tiles += ok.filter(Boolean).length;
        setState({ busy: true, text: `Map tiles: ${tiles} of ${list.length}…` });
      }
    }
    const est = await navigator.storage?.estimate?.().catch(() => undefined);
    const parts = [
      failed ? `${urls.length - failed} of ${urls.length} parts kept (${failed} could not be loaded: try again with a better connection).` : `Case, lines, walk and places kept on this phone.`,
      settings.tileUrl
        ? settings.tilePrefetchMax > 0
          ? `${tiles} map tiles fetched ahead (at most ${settings.tilePrefetchMax}).`
          : 'Map tiles: only those you have viewed stay (the tile server does not allow fetching ahead).'
        : '',
      est?.usage !== undefined ? `Storage used by Quietfix on this phone: ${mb(est.usage)}${est.quota ? ` of ${mb(est.quota)} available` : ''}.` : '',
    ];
    setState({ busy: false, text: parts.filter(Boolean).join(' ') });
  };

  return (
    <section aria-label="Prepare for the field" className="card space-y-2">
      <button type="button" className="btn-quiet min-h-12 w-full" disabled={state.busy} onClick={() => void prepare()} data-testid="prepare-area">
        Prepare for the field
      </button>
      {state.text && (
        <p role="status" data-testid="prepare-result">
          {state.text}
        </p>
      )}
    </section>
  );
}
