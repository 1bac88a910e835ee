import { describe, expect, it } from 'vitest';
import { fitWindowToDisplays, type WindowState } from '../../src-main/electron/windowState.js';

const laptop = { x: 0, y: 0, width: 1366, height: 728 };
const monitorRight = { x: 1366, y: 0, width: 2560, height: 1400 };

function state(x: number, y: number, width: number, height: number, maximized = false): WindowState {
  return { format: 'tallyline.window/1', x, y, width, height, maximized };
}

describe('fitWindowToDisplays', () => {
  it('keeps a window that is wholly on the second monitor where it was', () => {
    expect(fitWindowToDisplays(state(2000, 200, 1400, 900), [laptop, monitorRight])).toEqual({ x: 2000, y: 200, width: 1400, height: 900, maximized: false });
  });

  it('moves a window hanging off the right edge back inside the display it mostly covers', () => {
    expect(fitWindowToDisplays(state(3500, 900, 1000, 700), [laptop, monitorRight])).toEqual({ x: 2926, y: 700, width: 1000, height: 700, maximized: false });
  });

  it('shrinks a window larger than its display to the work area, never below the minimum size otherwise', () => {
    expect(fitWindowToDisplays(state(0, 0, 3000, 2000), [laptop])).toMatchObject({ x: 0, y: 0, width: 1366, height: 728 });
    expect(fitWindowToDisplays(state(10, 10, 300, 200), [monitorRight, laptop])).toMatchObject({ width: 960, height: 640 });
  });

  it('opens at the default size centred on the primary display without a remembered state', () => {
    expect(fitWindowToDisplays(null, [monitorRight, laptop])).toEqual({ x: 1366 + 640, y: 300, width: 1280, height: 800, maximized: false });
  });
});
