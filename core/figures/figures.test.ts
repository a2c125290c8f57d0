import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { describe, expect, it } from 'vitest';
import { analyseCohort, makeDemoCohort, parseSampleSheet } from '../cohort';
import { cohortFigures, cohortProfilesFigure, escapeXml, lambdaByConditionFigure, positionalErrorFigure, profileFigure, shiftVsLnFFigure } from './index';

// Source: demo data throughout (invented synthetic embryos); XML rules per W3C XML 1.0 (well-formedness), checked by fast-xml-parser.
const count = (svg: string, re: RegExp): number => (svg.match(re) ?? []).length;

function checkSvg(svg: string): void {
  expect(XMLValidator.validate(svg)).toBe(true);
  expect(svg).not.toMatch(/NaN|Infinity|undefined/);
  const doc = new XMLParser({ ignoreAttributes: false }).parse(svg) as { svg: Record<string, string> };
  expect(doc.svg['@_xmlns']).toBe('http://www.w3.org/2000/svg');
  expect(doc.svg['@_font-family']).toBe('system-ui, sans-serif');
}

const demo = makeDemoCohort({ conditions: [{ name: 'low <A&B>', dosage: 0.5, count: 5 }, { name: 'ref', dosage: 1, count: 5 }, { name: 'high', dosage: 2, count: 5 }], seed: 2 });
const analysis = analyseCohort(demo.results, parseSampleSheet(demo.sheetCsv, 's.csv'), { lambdaPosteriorEl: 0.3 });

describe('escapeXml', () => {
  it('escapes the five XML special characters', () => {
    // Source: W3C XML 1.0 §2.4 (predefined entities)
    expect(escapeXml(`a<b>&"c"'`)).toBe('a&lt;b&gt;&amp;&quot;c&quot;&apos;');
  });
});

describe('profileFigure', () => {
  const e = demo.results[6];
  it('keeps the legend and every label off the data: legend, then label rows, then the plot; no two labels overlap', () => {
    // Demo data: two boundary channels and three landmarks crowded near one place, so labels must stack.
    const b0 = e.boundaries[0];
    const boundaries = [b0, { ...b0, channel: 'second', positionEl: (b0.positionEl as number) + 0.01 }];
    const landmarks = ['furrow', 'fold', 'notch'].map((name, i) => ({ ...e.landmarks[0], name, xEl: (b0.positionEl as number) + 0.005 * i }));
    const svg = profileFigure({ profile: e.gradientProfile!, fit: e.gradientFit, boundaries, landmarks }, { showResiduals: true, heightPx: 520 });
    checkSvg(svg);
    const plotTop = Number(/<clipPath id="[^"]+"><rect x="[^"]+" y="([^"]+)"/.exec(svg)?.[1]);
    const legend = /class="legend legend-rows" data-top="([^"]+)" data-height="([^"]+)"/.exec(svg);
    const legendBottom = Number(legend?.[1]) + Number(legend?.[2]);
    const labels = [...svg.matchAll(/<text class="(boundary|landmark)-label" x="([^"]+)" y="([^"]+)"[^>]*>([^<]+)</g)]
      .map((m) => ({ x: Number(m[2]), y: Number(m[3]), w: m[4].length * 5.9 }));
    expect(labels).toHaveLength(5);
    for (const l of labels) {
      // Font size 10: the glyphs reach about 8 px above the baseline and 3 px below it (from memory).
      expect(l.y - 8).toBeGreaterThanOrEqual(legendBottom);
      expect(l.y + 3).toBeLessThanOrEqual(plotTop);
    }
    for (let i = 0; i < labels.length; i++) for (let j = i + 1; j < labels.length; j++) {
      const [p, q] = [labels[i], labels[j]];
      const apart = p.y !== q.y || p.x + p.w <= q.x || q.x + q.w <= p.x;
      expect(apart).toBe(true);
    }
    // The two boundary channels keep the window's colours (by their order).
    expect(svg).toContain('stroke="#CC79A7"');
    expect(svg).toContain('stroke="#009E73"');
  });
  it('draws earlier profiles of a movie faded behind the current one, oldest faintest, on a fixed intensity range', () => {
    // Demo data: the same profile at a quarter, half and three quarters of its height stands for earlier time points.
    const p = e.gradientProfile!;
    const earlier = [0.25, 0.5, 0.75].map((f) => ({ xEl: p.xEl, mean: p.mean.map((v) => v * f) }));
    const svg = profileFigure({ profile: p, fit: e.gradientFit, earlier }, { yDomain: [0, 2 * Math.max(...p.mean)] });
    checkSvg(svg);
    expect([...svg.matchAll(/class="earlier-profile"[^>]*stroke-opacity="([^"]+)"/g)].map((m) => Number(m[1]))).toEqual([0.12, 0.31, 0.5]);
    expect(svg).toContain('earlier time points (fainter = older)');
    expect(svg.indexOf('earlier-profile')).toBeLessThan(svg.indexOf('class="data-point"'));
    expect(count(profileFigure({ profile: p }), /earlier/g)).toBe(0);
  });
  it('keeps the y-axis title inside a short figure by shortening it', () => {
    // Demo data: the same profile in a figure 300 px tall (a panel of the window at 1280×720) and 420 px tall.
    const p = e.gradientProfile!;
    const title = (svg: string): string => [...svg.matchAll(/class="axis-title"[^>]*>([^<]*)</g)].map((m) => m[1]).find((t) => t.startsWith('intensity'))!;
    expect(title(profileFigure({ profile: p, fit: e.gradientFit }, { heightPx: 300 }))).toBe('intensity − bg (a.u.)');
    expect(title(profileFigure({ profile: p, fit: e.gradientFit }, { heightPx: 420 }))).toBe('intensity (a.u., background subtracted)');
    expect(title(profileFigure({ profile: p }, { heightPx: 300, yLabel: 'intensity ÷ reference' }))).toBe('intensity ÷ reference');
  });
  it('draws one point per bin, the fit over its range, boundaries and landmarks, labelled axes', () => {
    const svg = profileFigure({ profile: e.gradientProfile!, fit: e.gradientFit, boundaries: e.boundaries, landmarks: e.landmarks });
    checkSvg(svg);
    expect(count(svg, /class="data-point"/g)).toBe(100);
    expect(count(svg, /class="fit-curve"/g)).toBe(1);
    expect(count(svg, /class="fit-range"/g)).toBe(1);
    expect(count(svg, /class="boundary"/g)).toBe(1); // two methods at nearly the same place share a label
    expect(svg).toMatch(/target (logistic|half-max) \/ (logistic|half-max)/);
    expect(count(svg, /class="landmark"/g)).toBe(1);
    expect(svg).toContain('x/EL (0 = anterior pole)');
    expect(svg).toContain('furrow');
    expect(svg).toContain('λ = ');
  });
  it('residual panel and µm axis on request', () => {
    const fit = { ...e.gradientFit!, xEl: Float64Array.from([0.1, 0.2, 0.3]), residuals: Float64Array.from([1, -2, 0.5]) };
    const svg = profileFigure({ profile: e.gradientProfile!, fit }, { showResiduals: true, xAxis: 'um', widthPx: 500, heightPx: 500 });
    checkSvg(svg);
    expect(count(svg, /class="residual-point"/g)).toBe(3);
    expect(svg).toContain('distance from the anterior pole (µm)');
    expect(svg).toContain('width="500"');
  });
  it('rejects bad sizes with an exact message', () => {
    expect(() => profileFigure({ profile: e.gradientProfile! }, { widthPx: 10 })).toThrow('widthPx must be a number from 120 to 4000');
  });
  it('NaN bins are gaps, not "NaN" in the file', () => {
    const p = e.gradientProfile!;
    const mean = Float64Array.from(p.mean);
    mean[10] = NaN;
    const svg = profileFigure({ profile: { ...p, mean } });
    checkSvg(svg);
    expect(count(svg, /class="data-point"/g)).toBe(99);
  });
});

describe('cohort figures', () => {
  it('one figure per kind plus one shift figure per position quantity; all valid, labels escaped', () => {
    const figs = cohortFigures(analysis);
    expect(figs.map((f) => f.name)).toEqual(['cohort-profiles', 'lambda-by-condition', 'shift-boundary-target-logistic', 'shift-boundary-target-half-max', 'shift-landmark-furrow', 'positional-error']);
    for (const f of figs) checkSvg(f.svg);
    const prof = figs[0].svg;
    expect(count(prof, /class="mean-line"/g)).toBe(3);
    expect(count(prof, /class="sd-band"/g)).toBe(3);
    expect(prof).toContain('low &lt;A&amp;B&gt; (n=5)');
    const lam = figs[1].svg;
    expect(count(lam, /class="embryo-point"/g)).toBe(15);
    expect(count(lam, /class="ci-bar"/g)).toBe(3);
    expect(lam).toContain('decay length λ (fraction of egg length, EL)');
    const shift = figs[2].svg;
    expect(count(shift, /class="embryo-point"/g)).toBe(15);
    expect(count(shift, /class="fitted-line"/g)).toBe(1);
    expect(count(shift, /class="predicted-line"/g)).toBe(2);
    expect(count(shift, /class="group-mean"/g)).toBe(3);
    expect(shift).toContain('ln f (f = dosage relative to the reference)');
    expect(count(figs[5].svg, /class="sigma-line"/g)).toBe(3);
    expect(figs[5].svg).toContain('positional error σx (fraction of EL)');
  });
  it('with each side measured apart: a strip figure of λ_dorsal − λ_ventral per condition with a line at zero', () => {
    // Demo data: the demo cohort's results given invented paired differences of 0.001·k EL.
    const withSides = demo.results.map((r, k) => ({
      ...r, sides: {
        dorsalProfile: r.gradientProfile!, ventralProfile: r.gradientProfile!, dorsalFit: r.gradientFit, ventralFit: r.gradientFit,
        difference: { lambdaUm: NaN, lambdaEl: 0.001 * k, seUm: NaN, seEl: 0.001, ciLowUm: NaN, ciHighUm: NaN, ciLowEl: 0, ciHighEl: 0, seModelEl: 0.001, seSerialEl: NaN, seSource: 'model' as const, sideCorrelation: 0, dof: 40 },
      },
    }));
    const figs = cohortFigures(analyseCohort(withSides, parseSampleSheet(demo.sheetCsv, 's.csv')));
    const sides = figs[figs.length - 1];
    expect(sides.name).toBe('lambda-dorsal-minus-ventral');
    checkSvg(sides.svg);
    expect(count(sides.svg, /class="embryo-point"/g)).toBe(15);
    expect(count(sides.svg, /class="zero-line"/g)).toBe(1);
    expect(sides.svg).toContain('λ dorsal − λ ventral (EL)');
  });
  it('shift figures: readable titles, legends with enough digits that the interval ends differ', () => {
    const figs = cohortFigures(analysis);
    expect(figs[2].title).toBe('boundary in ‘target’ (logistic): position vs ln f');
    const m = /fitted: slope λ_eff = (\d\.\d+) \[(\d\.\d+), (\d\.\d+)\]/.exec(figs[2].svg);
    expect(m).not.toBeNull();
    expect(m![2]).not.toBe(m![3]);
    expect(m![1].length).toBeGreaterThanOrEqual(5); // at least 3 significant digits, e.g. 0.197
    expect(figs[2].svg).toMatch(/predicted: slope λ_ref = \d\.\d+ \[\d\.\d+, \d\.\d+\]/);
  });
  it('σx figure: wild values are clipped at the top, marked ▲ and counted in the subtitle', () => {
    // Source: demo data (hand-made σx series).
    const xEl = Array.from({ length: 11 }, (_, i) => i / 10);
    const calm = xEl.map(() => 0.01);
    const wild = xEl.map((x) => (x > 0.85 ? 5 : 0.012));
    const svg = positionalErrorFigure([{ label: 'calm', xEl, sigma: calm }, { label: 'wild', xEl, sigma: wild }]);
    checkSvg(svg);
    expect(count(svg, /class="clipped-mark"/g)).toBe(2); // x = 0.9 and 1.0; the 80th percentile (0.012) sets the top
    // 1.5 × 0.012 = 0.018, rounded up to the nice axis top 0.020 (d3 nice).
    expect(svg).toContain('▲ at the top: 2 values above 0.020 EL (clipped; see positional_error.csv)');
    expect(svg).not.toMatch(/y="-\d{3,}/); // no far-off coordinates
    const plain = positionalErrorFigure([{ label: 'calm', xEl, sigma: calm }]);
    expect(count(plain, /class="clipped-mark"/g)).toBe(0);
    expect(plain).not.toContain('clipped');
  });
  it('empty inputs still give valid SVG', () => {
    for (const svg of [cohortProfilesFigure([]), lambdaByConditionFigure([]), positionalErrorFigure([]), shiftVsLnFFigure({ quantity: 'q', points: [] })]) checkSvg(svg);
    checkSvg(lambdaByConditionFigure([{ label: 'one', values: [0.2], mean: 0.2, ciLow: NaN, ciHigh: NaN }]));
  });
});
