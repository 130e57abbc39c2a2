import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { scheduleSchema, type Schedule } from '../../../shared/schemas/schedule.js';
import { surveyWaySchema } from '../../../shared/schemas/survey.js';
import type { CircuitKind } from '../../../shared/schemas/schedule.js';
import { acceptRcdSplit, EXPECTED_MA, STANDING_CURRENT_SHARE, suggestRcdSplit } from '../../../shared/schedule/rcd-split.js';
import { applyPlan } from '../../../shared/schedule/apply-plan.js';
import { rcdGroups } from '../../../shared/schedule/derive.js';
import { bungalowBoard } from '../../../server/seed/demo-bungalow.js';

interface Way {
  label: string;
  kind: CircuitKind;
  feeds?: string;
  device?: 'mcb' | 'rcbo';
  ne?: number;
}

/** A board whose survey plans one new way per old way, MCBs unless told otherwise (invented test data). */
function planned(ways: Way[]): Schedule {
  return scheduleSchema.parse({
    board: { name: 'Test board', supply: { earthing: 'TN-C-S' }, modulesPerRow: 24 },
    devices: [{ id: 'main', row: 1, kind: 'main-switch', modules: 2, poles: 2 }],
    circuits: [],
    survey: {
      ways: ways.map((w, i) =>
        surveyWaySchema.parse({
          id: `o${i}`,
          reference: `Fuse ${i + 1}`,
          feeds: w.feeds ?? '',
          kind: w.kind,
          legs: 1,
          action: 'keep',
          readings: w.ne ? { insulation: { testVoltage: 500, neutralEarth: w.ne } } : undefined,
          targets: [
            { circuitId: `c${i}`, way: i + 1, label: w.label, kind: w.kind, device: { kind: w.device ?? 'mcb', rating: w.kind === 'lighting' ? 6 : 32 } },
          ],
        }),
      ),
    },
  });
}
const rcdOf = (s: ReturnType<typeof suggestRcdSplit>, label: string) => s!.places.find((p) => p.label === label)!.rcd;

describe('suggesting how the planned MCB ways share the new RCDs', () => {
  it('when each area has lights and sockets, then they go on different RCDs, the lighting is spread, and each reason says why', () => {
    const s = suggestRcdSplit(
      planned([
        { label: 'Lights front', kind: 'lighting' },
        { label: 'Lights back', kind: 'lighting' },
        { label: 'Sockets front', kind: 'ring' },
        { label: 'Sockets back', kind: 'ring' },
      ]),
    )!;
    expect(s.rcds).toHaveLength(2);
    expect(rcdOf(s, 'Lights front')).not.toBe(rcdOf(s, 'Sockets front'));
    expect(rcdOf(s, 'Lights back')).not.toBe(rcdOf(s, 'Sockets back'));
    expect(rcdOf(s, 'Lights front')).not.toBe(rcdOf(s, 'Lights back'));
    const front = s.places.find((p) => p.label === 'Lights front')!;
    expect(front.why).toContain('Sockets front');
    expect(front.why).toContain('BS 7671 531.3.2');
    // 30 % of 30 mA = 9 mA (BS 7671:2018 531.3.2, from memory)
    for (const r of s.rcds) expect(r.limitMa).toBeCloseTo(9, 9);
  });

  it('when the expected currents pass 30 % of IΔn on two RCDs, then a third is added and none is over', () => {
    // Seven rings at 1.5 mA each (our estimate) = 10.5 mA: more than one 30 mA RCD's 9 mA.
    const rings = Array.from({ length: 7 }, (_, i) => ({ label: `Ring ${i + 1}`, kind: 'ring' as const }));
    const s = suggestRcdSplit(planned(rings))!;
    expect(s.rcds.length).toBeGreaterThanOrEqual(2);
    for (const r of s.rcds) expect(r.expectedMa).toBeLessThanOrEqual(STANDING_CURRENT_SHARE * 30 + 1e-9);
    // A circuit with poor insulation adds what leaks through it at 230 V: 0.1 MΩ passes 2.3 mA.
    const leaky = suggestRcdSplit(planned([{ label: 'Garage', kind: 'radial', ne: 0.1 }]))!;
    expect(leaky.places[0]!.expectedMa).toBeCloseTo(EXPECTED_MA.radial + 2.3, 6);
  });

  it('when one lighting circuit serves every area, then the reason owns up to the socket circuit it shares an RCD with', () => {
    const s = suggestRcdSplit(
      planned([
        { label: 'Sockets front', kind: 'ring' },
        { label: 'Sockets back', kind: 'ring' },
        { label: 'Lights', kind: 'lighting', feeds: 'front and back rooms' },
      ]),
    )!;
    const lights = s.places.find((p) => p.label === 'Lights')!;
    expect(lights.why).toMatch(/it shares RCD \d with Sockets (front|back) of the same area/);
  });

  it('when a sub-main or an RCBO is planned, then the sub-main is kept off the 30 mA RCDs and the RCBO needs no place', () => {
    const s = suggestRcdSplit(
      planned([
        { label: 'Garage board', kind: 'sub-main' },
        { label: 'Cooker', kind: 'cooker', device: 'rcbo' },
        { label: 'Smoke alarms', kind: 'lighting' },
      ]),
    )!;
    expect(s.places.map((p) => [p.label, p.placed, p.rcd])).toEqual([
      ['Garage board', 'none', null],
      ['Cooker', 'own', null],
      ['Smoke alarms', 'rcd', 'RCD 1'],
    ]);
    expect(s.places[0]!.why).toMatch(/time-delayed RCD/);
    expect(s.notes.join(' ')).toMatch(/own RCBO/);
  });

  it('when the demo bungalow is asked, then every way already has its own RCBO and nothing needs arranging', () => {
    const s = suggestRcdSplit(bungalowBoard.schedule)!;
    expect(s.rcds).toEqual([]);
    expect(new Set(s.places.map((p) => p.placed))).toEqual(new Set(['own']));
  });

  it("when a suggestion is accepted and the plan applied, then the new board's RCD groups are the suggestion's", () => {
    const board = planned([
      { label: 'Lights front', kind: 'lighting' },
      { label: 'Lights back', kind: 'lighting' },
      { label: 'Sockets front', kind: 'ring' },
      { label: 'Sockets back', kind: 'ring' },
      { label: 'Annex', kind: 'sub-main' },
    ]);
    const s = suggestRcdSplit(board)!;
    const out = applyPlan(acceptRcdSplit(board, s));
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    const byName = (a: { name: string }, b: { name: string }) => a.name.localeCompare(b.name);
    const groups = rcdGroups(out.schedule)
      .map((g) => ({ name: g.name, ways: g.circuits.map((c) => c.way) }))
      .sort(byName);
    expect(groups).toEqual(s.rcds.map((r) => ({ name: r.name, ways: r.ways })).sort(byName));
    const annex = out.schedule.circuits.find((c) => c.label === 'Annex')!;
    expect(out.schedule.devices.find((d) => d.id === annex.deviceId)!.protectedBy).toBeNull();
  });

  it('for any plan of MCB ways whose circuits each fit under the limit, every RCD stays under 30 % of IΔn and every way is placed', () => {
    const kinds: CircuitKind[] = ['ring', 'radial', 'lighting', 'cooker', 'shower', 'immersion', 'fixed-appliance', 'other'];
    fc.assert(
      fc.property(
        fc.array(fc.record({ kind: fc.constantFrom(...kinds), area: fc.constantFrom('front', 'back', 'upstairs', 'garage') }), { minLength: 1, maxLength: 16 }),
        (gen) => {
          const s = suggestRcdSplit(planned(gen.map((g, i) => ({ label: `${g.area} ${i}`, kind: g.kind }))))!;
          expect(s.places).toHaveLength(gen.length);
          for (const p of s.places) expect(p.rcd).not.toBeNull();
          for (const r of s.rcds) expect(r.expectedMa).toBeLessThanOrEqual(9 + 1e-9);
          expect(s.rcds.reduce((n, r) => n + r.ways.length, 0)).toBe(gen.length);
        },
      ),
      { numRuns: 200 },
    );
  });
});
