import { describe, expect, it } from 'vitest';
import { fitCamera, screen, screenToWorld, snapAngle, snapToGrid, world, worldToScreen, zoomAt } from '../../src/editor/geometry/coords';

describe('world and screen coordinates', () => {
  const cam = { zoom: 0.1, panX: 40, panY: 25 };

  it('converts there and back', () => {
    const w = world(4200, 3600);
    const s = worldToScreen(cam, w);
    expect(s).toEqual({ x: 460, y: 385 });
    expect(screenToWorld(cam, s)).toEqual({ x: 4200, y: 3600 });
  });

  it('keeps the point under the pointer fixed while zooming', () => {
    const anchor = screen(300, 200);
    const before = screenToWorld(cam, anchor);
    const after = screenToWorld(zoomAt(cam, anchor, 2.5), anchor);
    expect(after.x).toBeCloseTo(before.x, 6);
    expect(after.y).toBeCloseTo(before.y, 6);
  });

  it('fits a plan inside the viewport with its centre in the middle', () => {
    const c = fitCamera(
      [
        [0, 0],
        [8000, 0],
        [8000, 4000],
        [0, 4000],
      ],
      1000,
      600,
      50,
    );
    expect(c.zoom).toBeCloseTo(900 / 8000, 9);
    const centre = worldToScreen(c, world(4000, 2000));
    expect(centre.x).toBeCloseTo(500, 6);
    expect(centre.y).toBeCloseTo(300, 6);
  });

  it('snaps to the grid and to 45° steps with grid-step lengths', () => {
    expect(snapToGrid(world(1049, 1951), 100)).toEqual({ x: 1000, y: 2000 });
    expect(snapAngle(world(0, 0), world(3010, 140), 45, 100)).toEqual({ x: 3000, y: 0 });
    const d = snapAngle(world(0, 0), world(1000, 1100), 45, 100);
    expect(d.x).toBeCloseTo(d.y, 3);
  });
});
