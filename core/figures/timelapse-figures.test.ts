import { XMLValidator } from 'fast-xml-parser';
import { describe, expect, it } from 'vitest';
import { accumulationFigure, kymographFigure, lambdaOverTimeFigure, movieTimeUnit } from './index';

// Source: demo data throughout (invented values); XML well-formedness per W3C XML 1.0, checked by fast-xml-parser.
const count = (svg: string, re: RegExp): number => (svg.match(re) ?? []).length;
function checkSvg(svg: string): void {
  expect(XMLValidator.validate(svg)).toBe(true);
  expect(svg).not.toMatch(/NaN|Infinity|undefined/);
}

const timesS = Float64Array.from({ length: 20 }, (_, t) => t * 120);
const xEl = Float64Array.from({ length: 50 }, (_, i) => (i + 0.5) / 50);

describe('movieTimeUnit', () => {
  it('uses minutes from 10 minutes on', () => {
    expect(movieTimeUnit(599)).toEqual({ unit: 's', perS: 1 });
    expect(movieTimeUnit(600)).toEqual({ unit: 'min', perS: 1 / 60 });
  });
});

describe('lambdaOverTimeFigure', () => {
  it('draws a dot and whisker per fitted time point, skips failed ones, and the steady λ line', () => {
    const points = Array.from(timesS, (tS, i) => ({ tS, lambdaEl: i === 0 ? NaN : 0.2 - 0.1 * Math.exp(-i / 4), ciLowEl: 0.18, ciHighEl: 0.22 }));
    const svg = lambdaOverTimeFigure(points, { steadyLambdaEl: 0.2 });
    checkSvg(svg);
    expect(count(svg, /class="lambda-point"/g)).toBe(19);
    expect(count(svg, /class="ci-bar"/g)).toBe(19);
    expect(count(svg, /class="steady-lambda"/g)).toBe(1);
    expect(svg).toContain('time (min)');
  });
});

describe('kymographFigure', () => {
  it('draws one cell per bin and time point, with boundary and landmark tracks', () => {
    const values = Array.from(timesS, (t) => xEl.map((x) => (1 - Math.exp(-t / 600)) * Math.exp(-x / 0.2)));
    const boundary = Array.from(timesS, (t) => (t < 240 ? NaN : 0.2 + t / 24000));
    const svg = kymographFigure({ xEl, timesS, values, tracks: [{ label: 'target boundary', kind: 'boundary', xEl: boundary }, { label: 'furrow', kind: 'landmark', xEl: timesS.map(() => 0.3) }] });
    checkSvg(svg);
    const cells = svg.match(/<g class="kymograph-cells">(.*?)<\/g>/)![1];
    expect(count(cells, /<rect /g)).toBe(20 * 50);
    expect(count(svg, /class="track boundary"/g)).toBe(1);
    expect(count(svg, /class="track landmark"/g)).toBe(1);
    // Each track carries its positions (x/EL per time point) beside the drawn line.
    expect(svg).toContain(`data-label="furrow" data-x-el="${Array.from(timesS, () => '0.3').join(' ')}"`);
    expect(svg).toContain('x/EL (0 = anterior pole)');
  });

  it('draws a movie analysed at one time point as one row filling the plot, on a time axis with plain tick labels', () => {
    const svg = kymographFigure({ xEl, timesS: Float64Array.of(10800), values: [xEl.map((x) => Math.exp(-x / 0.2))] });
    checkSvg(svg);
    const cells = svg.match(/<g class="kymograph-cells">(.*?)<\/g>/)![1];
    expect(count(cells, /<rect /g)).toBe(50);
    const heights = [...cells.matchAll(/height="([\d.]+)"/g)].map((m) => Number(m[1]));
    expect(Math.min(...heights)).toBeGreaterThan(100);
    // 10800 s = 180 min, with ticks on either side; no tick label carries a long run of digits.
    expect(svg).toMatch(/>180\.0</);
    expect(svg).not.toMatch(/>[^<]*\d{6,}[^<]*</);
  });
});

describe('accumulationFigure', () => {
  it('draws τ with intervals, the fitted line and the model line', () => {
    const tau = xEl.map((x) => 600 * (1 + x / 0.2));
    const svg = accumulationFigure({ xEl, tauS: tau, ciLowS: tau.map((v) => v - 50), ciHighS: tau.map((v) => v + 50), fit: { tau0S: 600, lambdaTauEl: 0.2, rangeEl: [0.1, 0.4], steadyLambdaEl: 0.2 } });
    checkSvg(svg);
    expect(count(svg, /class="tau-point"/g)).toBe(50);
    expect(count(svg, /class="tau-fit"/g)).toBe(1);
    expect(count(svg, /class="tau-model"/g)).toBe(1);
    expect(svg).toContain('local accumulation time τ (min)');
  });

  it('says so when no position has a measurable τ', () => {
    const svg = accumulationFigure({ xEl, tauS: xEl.map(() => NaN), ciLowS: xEl, ciHighS: xEl, fit: null });
    checkSvg(svg);
    expect(svg).toContain('no position with a measurable τ');
  });
});

describe('the shown time point on λ over time and the kymograph', () => {
  it('draws one marker line at the time point (position by hand from the plot area and the axis domain)', () => {
    const points = Array.from(timesS, (tS) => ({ tS, lambdaEl: 0.2, ciLowEl: 0.18, ciHighEl: 0.22 }));
    // 640 px wide, margins 68 and 20: the plot spans 68 … 620; the x domain is 0 … 38 min (nice: 0 … 40 min).
    const lambda = lambdaOverTimeFigure(points, { markTimeS: 1200 });
    checkSvg(lambda);
    expect(lambda).toMatch(/<line x1="344"[^>]*class="time-marker"/); // 68 + 552 × 20/40
    expect(count(lambdaOverTimeFigure(points), /time-marker/g)).toBe(0);
    // The kymograph's time axis runs down from 0 (top 52) to 38 min (bottom 400 − 52 = 348): 19 min sits at 200.
    const values = Array.from(timesS, () => xEl.map(() => 1));
    const kymo = kymographFigure({ xEl, timesS, values }, { markTimeS: 1140 });
    checkSvg(kymo);
    expect(kymo).toMatch(/<line x1="68" y1="200"[^>]*class="time-marker"/);
  });
});
