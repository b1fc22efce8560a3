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
