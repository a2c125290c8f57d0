import { describe, expect, it } from 'vitest';
import type { ProjectDoc } from '../../core/contract';
import type { StackInfo } from '../../core/model';
import { pagesAsTimePoints } from '../../core/tiff';
import { newProject } from '../project';
import { DEFAULT_TIMELAPSE_OPTIONS, timePassNeeds, type TimeShape } from './timelapse-options';

const withStep = { ...DEFAULT_TIMELAPSE_OPTIONS, timeStepS: 30 };

/** The number of time points the time pass reads a file of this shape as (the rule timePassNeeds must agree with):
 *  with a time step, a plain multi-page file's pages become frames (core/tiff pagesAsTimePoints). */
function framesAsRead(shape: TimeShape, timeStepS: number | null): number {
  const info = { ...shape, sizeC: 1, planeIfd: new Int32Array(shape.sizeZ * shape.sizeT), time: null } as unknown as StackInfo;
  return (timeStepS !== null && shape.sizeT === 1 && !shape.isOme ? pagesAsTimePoints(info) : info).sizeT;
}

describe('timePassNeeds', () => {
  it('agrees with how the time pass reads a file: several time points, or a plain multi-page file given a time step', () => {
    // demo data: every combination of a few shapes, with and without a time step
    for (const sizeT of [1, 2, 40]) {
      for (const sizeZ of [1, 3]) {
        for (const isOme of [false, true]) {
          for (const options of [DEFAULT_TIMELAPSE_OPTIONS, withStep]) {
            const shape = { sizeT, sizeZ, isOme };
            expect(timePassNeeds(null, 'a.tif', options, shape), JSON.stringify({ shape, step: options.timeStepS })).toBe(framesAsRead(shape, options.timeStepS) > 1);
          }
        }
      }
    }
  });

  it("takes a file's own time step from the project, and always hands over a file with time points of its own", () => {
    const base = newProject(null);
    const doc: ProjectDoc = { ...base, files: { 'pages.tif': { timeStepS: 10 }, 'one.tif': { time: '0:3' } } } as unknown as ProjectDoc;
    const plainPages = { sizeT: 1, sizeZ: 5, isOme: false };
    expect(timePassNeeds(null, 'pages.tif', DEFAULT_TIMELAPSE_OPTIONS, plainPages)).toBe(false);
    expect(timePassNeeds(doc, 'pages.tif', DEFAULT_TIMELAPSE_OPTIONS, plainPages)).toBe(true);
    expect(timePassNeeds(doc, 'one.tif', DEFAULT_TIMELAPSE_OPTIONS, { sizeT: 1, sizeZ: 1, isOme: true })).toBe(true);
  });
});
