import { describe, expect, it } from 'vitest';
import { rebaseSchedule } from '../../../src/stores/boardRebase.js';
import { makeSchedule } from '../../helpers/boards.js';
import type { Schedule } from '../../../shared/schemas/schedule.js';

const copy = (s: Schedule): Schedule => structuredClone(s);

describe('re-applying my edits onto a copy saved meanwhile', () => {
  it('when we changed different circuits, then both changes are kept and nothing conflicts', () => {
    const base = makeSchedule(4);
    const mine = copy(base);
    const theirs = copy(base);
    mine.circuits[0].label = 'Kitchen ring';
    theirs.circuits[2].measuredZs = 0.71;

    const result = rebaseSchedule(base, mine, theirs);

    expect(result.conflicts).toEqual([]);
    expect(result.applied).toBe(1);
    expect(result.schedule.circuits[0].label).toBe('Kitchen ring');
    expect(result.schedule.circuits[2].measuredZs).toBe(0.71);
  });

  it('when we both changed the same circuit differently, then the saved version stays and the conflict is named', () => {
    const base = makeSchedule(3);
    const mine = copy(base);
    const theirs = copy(base);
    mine.circuits[1].label = 'Mine';
    theirs.circuits[1].label = 'Theirs';

    const result = rebaseSchedule(base, mine, theirs);

    expect(result.schedule.circuits[1].label).toBe('Theirs');
    expect(result.conflicts).toEqual([`Way 2 (Mine) was changed by both`]);
    expect(result.applied).toBe(0);
  });

  it('when I changed Ze and they changed the fault current, then both supply values are kept', () => {
    const base = makeSchedule(2);
    const mine = copy(base);
    const theirs = copy(base);
    mine.board.supply.ze = 0.21;
    theirs.board.supply.pfcKa = 3.2;

    const result = rebaseSchedule(base, mine, theirs);

    expect(result.conflicts).toEqual([]);
    expect(result.schedule.board.supply).toMatchObject({ ze: 0.21, pfcKa: 3.2 });
  });

  it('when I added a circuit and they added another, then both are there, mine after the circuit I added it behind', () => {
    const base = makeSchedule(3);
    const mine = copy(base);
    const theirs = copy(base);
    mine.circuits.splice(1, 0, { ...structuredClone(base.circuits[0]), id: 'mine-new', way: 10, label: 'Garden sockets' });
    theirs.circuits.push({ ...structuredClone(base.circuits[0]), id: 'theirs-new', way: 11, label: 'Loft lights' });

    const result = rebaseSchedule(base, mine, theirs);

    expect(result.schedule.circuits.map((c) => c.id)).toEqual(['c1', 'mine-new', 'c2', 'c3', 'theirs-new']);
    expect(result.conflicts).toEqual([]);
  });

  it('when I removed a circuit they left alone, then it is gone; when they changed it, then it stays and is named', () => {
    const base = makeSchedule(3);
    const mine = copy(base);
    mine.circuits = mine.circuits.filter((c) => c.id !== 'c2' && c.id !== 'c3');
    const theirs = copy(base);
    theirs.circuits[2].label = 'Changed there';

    const result = rebaseSchedule(base, mine, theirs);

    expect(result.schedule.circuits.map((c) => c.id)).toEqual(['c1', 'c3']);
    expect(result.conflicts).toEqual([`Way 3 (${base.circuits[2].label}) was removed here but changed in the saved copy`]);
  });

  it('when I moved a device along the row, then my order is kept and their new device is slotted in after its neighbour', () => {
    const base = makeSchedule(3);
    const mine = copy(base);
    const theirs = copy(base);
    const [moved] = mine.devices.splice(3, 1);
    mine.devices.splice(1, 0, moved);
    theirs.devices.splice(2, 0, { ...structuredClone(base.devices[1]), id: 'spd-new', kind: 'spd' });

    const result = rebaseSchedule(base, mine, theirs);

    expect(result.schedule.devices.map((d) => d.id)).toEqual(['main', 'd3', 'd1', 'spd-new', 'd2']);
  });

  it('when nothing was edited, then the saved copy comes back unchanged', () => {
    const base = makeSchedule(5);
    const theirs = copy(base);
    theirs.circuits[4].label = 'Renamed there';
    const result = rebaseSchedule(base, copy(base), theirs);
    expect(result.schedule).toEqual(theirs);
    expect(result.applied).toBe(0);
  });
});
