import { describe, expect, it } from 'vitest';
import type { Schedule } from '../../../shared/schemas/schedule.js';
import { diffSchedules, waysChangedBetween } from '../../../shared/schedule/diff.js';
import { buildTemplate } from '../../../shared/schedule/templates.js';

/** A changed copy of the split-load layout: the test edits only what it is about. */
function edited(edit: (s: Schedule) => void): [Schedule, Schedule] {
  const before = buildTemplate('split-load-10');
  const after: Schedule = structuredClone(before);
  edit(after);
  return [before, after];
}

const wayOf = (s: Schedule, way: number) => s.circuits.find((c) => c.way === way)!;

describe('schedule diff', () => {
  it('when a way is renamed, an RCD added and Ze changed, then the summary reads as an electrician would say it', () => {
    const [a, b] = edited((s) => {
      s.board.supply.ze = 0.28;
      wayOf(s, 7).label = 'Garage sockets';
      s.devices.push({ ...s.devices.find((d) => d.id === 'rcd2')!, id: 'rcd3', row: 1, label: '' });
    });
    a.board.supply.ze = 0.35;
    const diff = diffSchedules(a, b);
    expect(diff.summary).toBe('supply Ze 0.35 → 0.28 Ω; RCD 3 added; way 7 renamed Garage sockets');
    expect(diff.changes.map((c) => [c.kind, c.path])).toEqual([
      ['changed', 'board.supply.ze'],
      ['added', 'devices.13'],
      ['changed', 'circuits.6.label'],
    ]);
    expect(diff.changes[0]).toMatchObject({ before: 0.35, after: 0.28 });
  });

  it('when nothing changed, then no changes and the summary says so', () => {
    const s = buildTemplate('all-rcbo-12');
    expect(diffSchedules(s, structuredClone(s))).toEqual({ changes: [], summary: 'No changes' });
  });

  it('when a circuit moves way, loses a device rating and gains a Zs reading, then each is one phrase', () => {
    const [a, b] = edited((s) => {
      wayOf(s, 8).way = 11;
      s.devices.find((d) => d.id === 'w6')!.rating = 32;
      wayOf(s, 2).measuredZs = 0.62;
    });
    const texts = diffSchedules(a, b).changes.map((c) => c.text);
    expect(texts).toEqual(['MCB B40 rating 40 → 32 A', 'way 2 measured Zs set to 0.62 Ω', 'way 8 moved to way 11']);
  });

  it('when circuits are added and removed, then the way and label are named', () => {
    const [a, b] = edited((s) => {
      s.circuits = s.circuits.filter((c) => c.way !== 5);
      s.circuits.push({ ...structuredClone(wayOf(s, 2)), id: 'garden', way: 10, deviceId: 'w10', label: 'Garden sockets' });
    });
    const texts = diffSchedules(a, b).changes.map((c) => c.text);
    expect(texts).toEqual(['way 10 added (Garden sockets)', 'way 5 removed (Smoke alarms)']);
  });

  it('when private notes change, then the summary says so without printing them', () => {
    const [a, b] = edited((s) => {
      s.board.privateNotes = 'Alarm code 4471';
      wayOf(s, 1).notes = 'Behind the fridge';
    });
    const diff = diffSchedules(a, b);
    expect(diff.summary).toBe('private notes changed; way 1 notes changed');
    expect(diff.summary).not.toContain('4471');
  });

  it('when devices swap places on a row, then the reordering is a change (it moves RCD groups)', () => {
    const [a, b] = edited((s) => {
      const i = s.devices.findIndex((d) => d.id === 'rcd2');
      [s.devices[i - 1], s.devices[i]] = [s.devices[i], s.devices[i - 1]];
    });
    expect(diffSchedules(a, b).changes.map((c) => c.text)).toEqual(['devices reordered on row 1']);
  });

  it('when many things change, then the summary names the first eight and counts the rest', () => {
    const [a, b] = edited((s) => {
      s.circuits.forEach((c, i) => {
        c.measuredZs = 0.5 + i / 100;
      });
      s.board.name = 'Renamed';
    });
    const summary = diffSchedules(a, b).summary;
    expect(summary.split('; ')).toHaveLength(9);
    expect(summary.endsWith('and 2 more changes')).toBe(true); // 1 board + 9 circuits = 10 changes
  });
});

describe('ways changed for reprinting labels', () => {
  it('when a label, a phase or the device text changes, then those ways; a Zs reading alone changes no label', () => {
    const [a, b] = edited((s) => {
      wayOf(s, 7).label = 'Garage sockets';
      s.devices.find((d) => d.id === 'w3')!.rating = 40;
      wayOf(s, 1).measuredZs = 0.4;
      wayOf(s, 4).description = 'Hall, lounge and kitchen';
    });
    expect(waysChangedBetween(a, b)).toEqual([3, 7]);
  });

  it('when a circuit is added, then its way is listed; a removed way is not (nothing is left to print)', () => {
    const [a, b] = edited((s) => {
      s.circuits = s.circuits.filter((c) => c.way !== 5);
      s.circuits.push({ ...structuredClone(wayOf(s, 2)), id: 'garden', way: 10, deviceId: 'w10', label: 'Garden sockets' });
    });
    expect(waysChangedBetween(a, b)).toEqual([10]);
  });

  it('when a circuit is renumbered, then its new way is listed', () => {
    const [a, b] = edited((s) => {
      wayOf(s, 9).way = 10;
    });
    expect(waysChangedBetween(a, b)).toEqual([10]);
  });
});
