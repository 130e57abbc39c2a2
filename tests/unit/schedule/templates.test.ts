import { describe, expect, it } from 'vitest';
import { scheduleSchema } from '../../../shared/schemas/schedule.js';
import { buildTemplate, scheduleTemplates, templateIds, templateIdSchema } from '../../../shared/schedule/templates.js';
import { rcdGroups } from '../../../shared/schedule/derive.js';
import { checkSchedule } from '../../../shared/rules/index.js';

const TODAY = '2026-06-15';

describe('starting layouts', () => {
  it.each(templateIds)('when %s is built, then the schema accepts it unchanged', (id) => {
    const s = buildTemplate(id);
    expect(scheduleSchema.parse(JSON.parse(JSON.stringify(s)))).toEqual(s);
  });

  it.each(templateIds)('when %s is checked, then it has no error or warning findings', (id) => {
    const serious = checkSchedule(buildTemplate(id), { today: TODAY }).filter((f) => f.severity !== 'info');
    expect(serious).toEqual([]);
  });

  it.each(templateIds)('when %s is built, then every row fits its modules and every circuit has a device', (id) => {
    const s = buildTemplate(id);
    for (let row = 1; row <= s.board.rows; row++) {
      const used = s.devices.filter((d) => d.row === row).reduce((sum, d) => sum + d.modules, 0);
      expect(used).toBeLessThanOrEqual(s.board.modulesPerRow);
    }
    const ids = new Set(s.devices.map((d) => d.id));
    for (const c of s.circuits) expect(ids.has(c.deviceId ?? '')).toBe(true);
  });

  it('when the split-load layout is built, then each of its two RCDs covers five ways with a lighting circuit on each', () => {
    const groups = rcdGroups(buildTemplate('split-load-10'));
    expect(groups.map((g) => g.name)).toEqual(['RCD 1', 'RCD 2']);
    expect(groups.map((g) => g.circuits.length)).toEqual([5, 4]); // way 10 is a spare MCB on RCD 2
    for (const g of groups) expect(g.circuits.some((c) => c.kind === 'lighting')).toBe(true);
  });

  it('when the three-phase layout is built, then it has three phases and single-phase ways on L1–L3', () => {
    const s = buildTemplate('three-phase-12');
    expect(s.board.phases).toBe(3);
    expect(new Set(s.circuits.map((c) => c.phase).filter(Boolean))).toEqual(new Set(['L1', 'L2', 'L3']));
    expect(Math.max(...s.devices.filter((d) => d.kind !== 'blank').map((d) => Number(d.id.match(/^w(\d+)/)?.[1] ?? 0)))).toBe(9);
  });

  it('when the all-RCBO layout is built, then every circuit has its own 30 mA RCBO', () => {
    const s = buildTemplate('all-rcbo-12');
    const byId = new Map(s.devices.map((d) => [d.id, d]));
    for (const c of s.circuits) expect(byId.get(c.deviceId!)).toMatchObject({ kind: 'rcbo', residualMa: 30 });
    expect(new Set(s.circuits.map((c) => c.deviceId)).size).toBe(s.circuits.length);
  });

  it('when a name and location are given, then the board carries them; the picker lists every layout', () => {
    const s = buildTemplate('dual-rcd-18', { name: 'Kitchen extension CU', location: 'Utility room' });
    expect(s.board).toMatchObject({ name: 'Kitchen extension CU', location: 'Utility room' });
    expect(scheduleTemplates.map((t) => t.id)).toEqual([...templateIds]);
    expect(templateIdSchema.safeParse('nope').success).toBe(false);
  });
});
