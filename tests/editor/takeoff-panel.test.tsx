// @vitest-environment happy-dom
import fs from 'node:fs';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import { TakeoffPanel } from '../../src/editor/ui/takeoff-panel';
import { planSchema } from '../../shared/plan/plan-schema';
import { computeTakeoff } from '../../shared/takeoff/compute-takeoff';
import { parseProductCatalogue } from '../../shared/takeoff/products';

const examples = path.join(__dirname, '..', '..', 'examples');
const plan = planSchema.parse(JSON.parse(fs.readFileSync(path.join(examples, 'rectangle.json'), 'utf8')));
const products = parseProductCatalogue(JSON.parse(fs.readFileSync(path.join(examples, 'products.json'), 'utf8')));
const runWith = (fuelPriceMinorPerKwh: number) => ({
  takeoff: computeTakeoff(plan, { products, settings: { fuelPriceMinorPerKwh } }),
  errors: [],
  warnings: [],
  elapsedMs: 1,
});

afterEach(cleanup);

describe('takeoff panel saving row', () => {
  it('shows the yearly saving in kWh and money when a fuel price is known', () => {
    render(<TakeoffPanel run={runWith(7)} units="metric" />);
    expect(screen.getByTestId('saving').textContent).toMatch(/^\d+ kWh · £/);
  });

  it('shows kWh only to a viewer given no fuel price (installers), never a £0 saving', () => {
    render(<TakeoffPanel run={runWith(0)} units="metric" />);
    expect(screen.getByTestId('saving').textContent).toMatch(/^\d+ kWh$/);
  });
});

describe('takeoff panel heat-loss figures', () => {
  it('shows the existing condition, the whole-ceiling U beside the insulated-area U, and the RdSAP default, each named', () => {
    const run = runWith(7);
    render(<TakeoffPanel run={run} units="metric" />);
    const t = run.takeoff;
    expect(screen.getByTestId('existing-condition-row').textContent).toBe('100 mm good');
    expect(screen.getByTestId('u-whole').textContent).toBe(`${t.uValueBeforeWholeCeiling.toFixed(2)} → ${t.uValueAfterWholeCeiling.toFixed(2)}`);
    expect(screen.getByTestId('u-insulated').textContent).toBe(`${t.uValueBefore.toFixed(2)} → ${t.uValueAfter.toFixed(2)}`);
    // RdSAP 2012 Table S9: 100 mm → 0.40, 270 mm → 0.16.
    expect(screen.getByTestId('u-rdsap').textContent).toBe('0.40 → 0.16');
    expect(screen.getByText('U whole ceiling')).toBeTruthy();
    expect(screen.getByText('RdSAP default (Table S9)')).toBeTruthy();
  });

  it('names what a U-value target is judged on, and a poor condition with what still counts', () => {
    const p = planSchema.parse({ ...plan, existing: { depthMm: 200, condition: 'patchy' }, target: { uValue: 0.18 } });
    render(<TakeoffPanel run={{ takeoff: computeTakeoff(p, { products }), errors: [], warnings: [], elapsedMs: 1 }} units="metric" />);
    expect(screen.getByTestId('existing-condition-row').textContent).toBe('200 mm patchy, counts as 100 mm');
    expect(screen.getByTestId('target-row').textContent).toMatch(/^U 0\.18 (met|not met), judged on the whole ceiling$/);
  });
});

describe('takeoff panel strips and cut list', () => {
  it('shows strip sizes as count × length × width and a cut list per roll with what is left', () => {
    const run = runWith(7);
    render(<TakeoffPanel run={run} units="metric" />);
    const layer = run.takeoff.layers[0];
    const sizes = screen.getByTestId(`strip-sizes-${layer.role}-${layer.roleIndex}`).textContent!;
    for (const s of layer.strips) expect(sizes).toContain(`${s.lengthMm} × ${s.widthMm}`);
    const rp = run.takeoff.rollPlan[0];
    const list = screen.getByTestId(`cut-list-${rp.productId}`).textContent!;
    expect(list).toContain(`${rp.rolls} rolls`);
    for (const l of rp.lanes) expect(list).toContain(`Roll ${l.roll}`);
    expect(list).toContain(rp.lanes[0].cuts[0].label);
  });
});
