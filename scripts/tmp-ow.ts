import { estimateFix } from '../lib/df';
import { sceneLines } from '../tests/unit/df/support/scene';
const SOURCE = { lat: 44.2, lon: -27.6 };
const spots = [{ fromSourceAzDeg: 30, rangeM: 900 }, { fromSourceAzDeg: 150, rangeM: 700 }, { fromSourceAzDeg: 260, rangeM: 500 }];
const lines = sceneLines(SOURCE, spots.map((s) => ({ ...s, oneWay: true })));
lines[2].azimuthDeg += 180;
console.log(JSON.stringify(estimateFix(lines), null, 1).slice(0, 1500));
