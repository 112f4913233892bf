import { it } from 'vitest';
import { parseQuantity, parseNumber, freezeRates, rateMapSeries, lockRates, safetyCautions } from '../../src/core';
const tryIt = (name: string, f: () => unknown) => { try { const r = f(); console.log(name, '=>', JSON.stringify(r)?.slice(0, 300)); } catch (e) { console.log(name, 'THROWS', (e as Error).name, (e as Error).message); } };
const cases: Array<[string, () => unknown]> = [
  ['1780 1800', () => parseQuantity('1780 1800', 'speed', 'rpm')],
  ['2½', () => parseQuantity('2½', 'speed', 'rpm')],
  ['num 2½', () => parseNumber('2½')],
  ['1780, 1800', () => parseQuantity('1780, 1800', 'speed', 'rpm')],
  ['bad kind', () => parseQuantity('1780', 'bogus' as any, 'rpm')],
  ['bad unit', () => parseQuantity('1780', 'speed', 5 as any)],
  ['bad field', () => parseQuantity('1780', 'speed', 'rpm', 5 as any)],
  ['caut null', () => safetyCautions(null as any)],
  ['caut rates str', () => safetyCautions({ flashRatesHz: '5' as any })],
  ['caut sweep null', () => safetyCautions({ flashSweepHz: null as any })],
  ['caut str', () => safetyCautions('x' as any)],
  ['freeze 1e308', () => freezeRates([{ speedHz: 1e308, symmetry: 1 }], 0, { minHz: 1, maxHz: 100 })],
  ['freeze 1e307', () => freezeRates([{ speedHz: 1e307, symmetry: 1 }], 0, { minHz: 1e306, maxHz: 1e308 })],
  ['freeze 1e307 b', () => freezeRates([{ speedHz: 1e307, symmetry: 1 },{ speedHz: 10, symmetry: 1 }], 1, { minHz: 1, maxHz: 100 })],
  ['rmap', () => { const m = rateMapSeries([{ speedHz: 10, symmetry: 1 }], { minHz: 1e-300, maxHz: 1e300 }, { points: 10, log: true }); return [Array.from(m.rates), m.apparentRpm.map(a=>Array.from(a))]; }],
  ['rmap lin', () => { const m = rateMapSeries([{ speedHz: 10, symmetry: 1 }], { minHz: 1e-300, maxHz: 1.7e308 }, { points: 10 }); return [Array.from(m.rates)]; }],
  ['rmap 5e-324', () => { const m = rateMapSeries([{ speedHz: 1, symmetry: 1 }], { minHz: 5e-324, maxHz: 1e-300 }, { points: 10, log: true }); return [Array.from(m.rates)]; }],
  ['lock big p', () => lockRates({ speedHz: 1e9, symmetry: 1000 }, { minHz: 1, maxHz: 1.000001 }).slice(0,3)],
  ['lock big p2', () => lockRates({ speedHz: 1e12, symmetry: 1000 }, { minHz: 1, maxHz: 1.000001 }).length],
];
it('scratch', () => { const i = Number(process.env.CASE); tryIt(cases[i][0], cases[i][1]); });
