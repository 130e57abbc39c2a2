/**
 * The editor's checks run a beat after typing stops and its derived facts are memoised in the store;
 * whatever the edits and however they are spaced, once the board has been still for the delay the
 * store must say exactly what the shared rules and the schema say about the copy checked whole.
 * Random schedules from the shared generators, random edit runs, the real Pinia store, fake timers.
 */
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import fc from 'fast-check';
import { createPinia, setActivePinia } from 'pinia';
import { nextTick, toRaw } from 'vue';
import { checkSchedule, maxZsByCircuit } from '../../../shared/rules/index.js';
import { scheduleSchema, type Schedule } from '../../../shared/schemas/schedule.js';
import { fieldErrors } from '../../../shared/schemas/errors.js';
import { spareWays } from '../../../shared/schedule/ways.js';
import { CHECK_DELAY_MS, useBoardStore } from '../../../src/stores/board.js';
import { schedule as anySchedule } from '../../helpers/schedule-arbitraries.js';

const clone = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T;

/** One edit as the editor's controls make it, and how long the electrician pauses after it. */
const edit = fc.record({
  what: fc.constantFrom('label', 'zs', 'way', 'rating', 'add', 'remove', 'kind'),
  at: fc.nat(),
  zs: fc.option(fc.double({ min: 0, max: 20, noNaN: true }), { nil: null }),
  text: fc.string({ maxLength: 30 }),
  way: fc.integer({ min: 1, max: 40 }),
  rating: fc.constantFrom(6, 16, 32, 40),
  pauseMs: fc.integer({ min: 0, max: 2 * CHECK_DELAY_MS }),
});
type Edit = typeof edit extends fc.Arbitrary<infer T> ? T : never;

function apply(s: Schedule, e: Edit, addCircuit: () => void): void {
  const circuit = s.circuits.length ? s.circuits[e.at % s.circuits.length] : undefined;
  const device = s.devices.length ? s.devices[e.at % s.devices.length] : undefined;
  if (e.what === 'add') addCircuit();
  else if (e.what === 'remove' && circuit) s.circuits.splice(s.circuits.indexOf(circuit), 1);
  else if (e.what === 'label' && circuit) circuit.label = e.text;
  else if (e.what === 'zs' && circuit) circuit.measuredZs = e.zs;
  else if (e.what === 'way' && circuit) circuit.way = e.way;
  else if (e.what === 'kind' && circuit) circuit.kind = circuit.kind === 'ring' ? 'radial' : 'ring';
  else if (e.what === 'rating' && device) device.rating = e.rating;
}

beforeEach(() => {
  vi.useFakeTimers();
  setActivePinia(createPinia());
});
afterEach(() => {
  vi.useRealTimers();
});

describe('checks off the typing path', () => {
  it('when any run of edits settles, then the findings, schema messages, spares and max Zs are those of the whole copy checked afresh', async () => {
    await fc.assert(
      fc.asyncProperty(anySchedule, fc.array(edit, { minLength: 1, maxLength: 12 }), async (start, edits) => {
        const store = useBoardStore();
        store.loaded = clone(start);
        store.working = clone(start);
        await nextTick();
        for (const e of edits) {
          apply(store.working!, e, () => store.addCircuit());
          await nextTick();
          // The screen reads them after every edit, so a value kept too long would show here.
          void [store.findings, store.fieldMessages, store.spares, store.maxZsById, store.dirty];
          vi.advanceTimersByTime(e.pauseMs);
        }
        vi.advanceTimersByTime(CHECK_DELAY_MS);
        await nextTick();

        const copy = clone(toRaw(store.working!));
        const today = store.today;
        expect(store.findings).toEqual(checkSchedule(copy, { today }));
        const parsed = scheduleSchema.safeParse(copy);
        expect(store.fieldMessages).toEqual(parsed.success ? {} : fieldErrors(parsed.error));
        expect(store.spares).toEqual(spareWays(copy));
        expect(store.maxZsById).toEqual(maxZsByCircuit(copy));
        expect(store.dirty).toBe(JSON.stringify(copy) !== JSON.stringify(start));
        store.reset();
      }),
      { numRuns: 150 },
    );
  });

  it('when an edit is typed, then the checks wait until the board has been still for the delay, and the unsaved marker does not', async () => {
    await fc.assert(
      fc.asyncProperty(
        anySchedule.filter((s) => s.circuits.length > 0),
        fc.double({ min: 0.5, max: 20, noNaN: true }),
        async (start, zs) => {
          const store = useBoardStore();
          store.loaded = clone(start);
          store.working = clone(start);
          await nextTick();
          const before = store.findings;
          store.working!.circuits[0].measuredZs = start.circuits[0].measuredZs === zs ? zs + 1 : zs;
          await nextTick();
          expect(store.dirty).toBe(true);
          vi.advanceTimersByTime(CHECK_DELAY_MS - 1);
          expect(store.findings).toBe(before);
          vi.advanceTimersByTime(1);
          expect(store.findings).toEqual(checkSchedule(clone(toRaw(store.working!)), { today: store.today }));
          store.reset();
        },
      ),
      { numRuns: 60 },
    );
  });
});
