/**
 * Our own map symbols as Leaflet divIcons (never the default marker images). Each carries a
 * qf-* class so browser tests can count them. Sizes are CSS pixels; anchors are the point on the
 * symbol that sits on the position.
 */
import L from 'leaflet';
import { PALETTE } from './map-styles';

/**
 * Icons are cached by their arguments: handing Leaflet the same icon object on every data refresh
 * keeps the marker element (and the keyboard focus on it) in place.
 */
function cached<A extends unknown[]>(make: (...args: A) => L.DivIcon): (...args: A) => L.DivIcon {
  const cache = new Map<string, L.DivIcon>();
  return (...args: A) => {
    const key = JSON.stringify(args);
    let icon = cache.get(key);
    if (!icon) {
      icon = make(...args);
      if (cache.size > 500) cache.clear();
      cache.set(key, icon);
    }
    return icon;
  };
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/** Where a bearing was taken from: a small dot. */
export const observerIcon = cached((outlier: boolean, excluded: boolean) =>
  L.divIcon({
    className: 'qf-observer',
    iconSize: [14, 14],
    iconAnchor: [7, 7],
    html: `<svg width="14" height="14" viewBox="0 0 14 14" aria-hidden="true"><circle cx="7" cy="7" r="5" fill="${
      excluded ? PALETTE.inkFaint : outlier ? PALETTE.flare500 : PALETTE.hush900
    }" stroke="#fff" stroke-width="2"/></svg>`,
  }),
);

/** Where two lines cross: a small cross. */
export const crossIcon = L.divIcon({
  className: 'qf-cross',
  iconSize: [12, 12],
  iconAnchor: [6, 6],
  html: `<svg width="12" height="12" viewBox="0 0 12 12" aria-hidden="true"><path d="M2 2L10 10M10 2L2 10" stroke="${PALETTE.ink}" stroke-width="2" stroke-linecap="round"/></svg>`,
});

/** The fix: a bold ring with a centre dot; dashed ring for the without-outliers alternative. */
export const fixIcon = cached((alternative: boolean) =>
  L.divIcon({
    className: alternative ? 'qf-fix-alt' : 'qf-fix',
    iconSize: [28, 28],
    iconAnchor: [14, 14],
    html: `<svg width="28" height="28" viewBox="0 0 28 28" aria-hidden="true"><circle cx="14" cy="14" r="10" fill="${alternative ? 'none' : '#fff'}" stroke="${
      alternative ? PALETTE.alarm800 : PALETTE.alarm600
    }" stroke-width="3"${alternative ? ' stroke-dasharray="5 3"' : ''}/><circle cx="14" cy="14" r="4" fill="${alternative ? PALETTE.alarm800 : PALETTE.alarm600}"/></svg>`,
  }),
);

/** A suggested next spot: a large target (48 px) with the expected ellipse size beside it. */
export const spotIcon = cached((label: string) =>
  L.divIcon({
    className: 'qf-spot',
    iconSize: [112, 48],
    iconAnchor: [24, 24],
    html: `<div style="display:flex;align-items:center;gap:4px;height:48px"><svg width="48" height="48" viewBox="0 0 48 48" aria-hidden="true"><circle cx="24" cy="24" r="21" fill="#fff" fill-opacity="0.85" stroke="${PALETTE.hush900}" stroke-width="3"/><circle cx="24" cy="24" r="12" fill="none" stroke="${PALETTE.hush900}" stroke-width="3"/><circle cx="24" cy="24" r="3.5" fill="${PALETTE.hush900}"/></svg><span style="background:#fff;color:${PALETTE.ink};border:2px solid ${PALETTE.hush900};border-radius:6px;padding:1px 5px;font:700 13px/1.3 system-ui,sans-serif;white-space:nowrap">${escapeHtml(label)}</span></div>`,
  }),
);

/** A position with a text label (reporter, chosen position): a shape plus a label. */
export const labelledPointIcon = cached((kind: 'reporter' | 'picked', label: string) => {
  const shape =
    kind === 'reporter'
      ? `<rect x="4" y="4" width="12" height="12" transform="rotate(45 10 10)" fill="${PALETTE.inkFaint}" stroke="#fff" stroke-width="2"/>`
      : `<circle cx="10" cy="10" r="7" fill="none" stroke="${PALETTE.flare700}" stroke-width="3"/><path d="M10 0V6M10 14V20M0 10H6M14 10H20" stroke="${PALETTE.flare700}" stroke-width="2.5"/>`;
  return L.divIcon({
    className: kind === 'reporter' ? 'qf-reporter' : 'qf-picked',
    iconSize: [20, 20],
    iconAnchor: [10, 10],
    html: `<div style="position:relative;width:20px;height:20px"><svg width="20" height="20" viewBox="0 0 20 20" aria-hidden="true">${shape}</svg><span style="position:absolute;left:22px;top:1px;background:#fff;color:${PALETTE.ink};border:1px solid ${PALETTE.inkFaint};border-radius:4px;padding:0 4px;font:600 12px/1.4 system-ui,sans-serif;white-space:nowrap">${escapeHtml(label)}</span></div>`,
  });
});

/** A grid-line label: plain text on the light background, never interactive. */
export const gridLabelIcon = cached((label: string, align: 'left' | 'top') =>
  L.divIcon({
    className: 'qf-grid-label',
    iconSize: [0, 0],
    iconAnchor: [0, 0],
    html: `<span style="position:absolute;${align === 'left' ? 'left:4px;top:-9px' : 'left:4px;top:4px'};color:${PALETTE.inkSoft};font:600 11px/1.4 system-ui,sans-serif;white-space:nowrap;background:rgba(243,245,241,0.85);padding:0 2px">${escapeHtml(label)}</span>`,
  }),
);
