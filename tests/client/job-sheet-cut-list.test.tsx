// @vitest-environment happy-dom
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { SheetSpace } from '../../shared/api/job-sheet';
import { CutList } from '../../src/features/job-sheet/components/cut-list';

afterEach(cleanup);

const cut = (stripId: string, label: string, piece: number, pieceCount: number, lengthMm: number) => ({
  id: `${stripId}-p${piece}`,
  stripId,
  stripNumber: Number(label.replace(/\D/g, '')),
  stripLabel: label,
  piece,
  pieceCount,
  lengthMm,
});

// One strip longer than a roll (two pieces across two rolls) and one short strip.
const space = {
  id: 'space-1',
  layers: [
    {
      key: 'base',
      role: 'base',
      label: 'Between the joists',
      productName: 'Wool roll',
      thicknessMm: 100,
      areaM2: 10,
      layDirectionDeg: 0,
      strips: [{ id: 's1' }, { id: 's2' }],
    },
  ],
  rolls: [
    { layerKey: 'base', rollNo: 1, productName: 'Wool roll', lanes: [{ lane: 1, widthMm: 370, cuts: [cut('s1', 'B1', 1, 2, 8300)], offcutMm: 0 }] },
    {
      layerKey: 'base',
      rollNo: 2,
      productName: 'Wool roll',
      lanes: [{ lane: 1, widthMm: 370, cuts: [cut('s1', 'B1', 2, 2, 1200), cut('s2', 'B2', 1, 1, 4000)], offcutMm: 3100 }],
    },
  ],
} as unknown as SheetSpace;

describe('cut list', () => {
  it('offers Laid once per strip, on its last piece, so two taps on one strip cannot cancel out', () => {
    const onTick = vi.fn();
    render(<CutList space={space} ticks={new Map()} onTick={onTick} />);
    expect(screen.getAllByTestId('laid-s1')).toHaveLength(1);
    expect(screen.getAllByTestId('laid-s2')).toHaveLength(1);
    expect(screen.getByTestId('laid-s1').textContent).toContain('Strip B1 laid');
    expect(screen.getAllByText('ticked laid with its last piece')).toHaveLength(1);
    fireEvent.click(screen.getByTestId('laid-s1'));
    expect(onTick).toHaveBeenCalledWith('strip-laid', 's1', true);
    // Each piece is still cut on its own.
    expect(screen.getByTestId('cut-s1-p1')).toBeTruthy();
    expect(screen.getByTestId('cut-s1-p2')).toBeTruthy();
  });
});
