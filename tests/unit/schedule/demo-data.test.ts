import { describe, expect, it } from 'vitest';
import { scheduleSchema } from '../../../shared/schemas/schedule.js';
import { siteInputSchema } from '../../../shared/schemas/site.js';
import { demoSites } from '../../../server/seed/demo-data.js';
import { checkSchedule } from '../../../shared/rules/index.js';

const TODAY = '2026-06-15';
const boards = demoSites.flatMap((s) => s.boards);
const byKey = new Map(boards.map((b) => [b.key, b]));

describe('demo data', () => {
  it('when every demo board is parsed, then the schema accepts it unchanged; every site passes the site schema', () => {
    for (const b of boards) expect(scheduleSchema.parse(JSON.parse(JSON.stringify(b.schedule)))).toEqual(b.schedule);
    for (const s of demoSites) expect(siteInputSchema.parse(s.site)).toEqual(s.site);
  });

  it("when the boards are checked, then the only errors are the deliberate old radial on flat way 5 and the bungalow's two before-you-swap failures", () => {
    const errors = boards.flatMap((b) =>
      checkSchedule(b.schedule, { today: TODAY })
        .filter((f) => f.severity === 'error')
        .map((f) => `${b.key} ${f.code} ${f.field ?? f.ways}`),
    );
    expect(errors).toEqual([
      'flat-main rating-over-iz circuits.4.cable.liveCsa', // 32 A on 2.5 mm² at method 103, Iz 13.5 A (BS 7671 Table 4D5, from memory)
      // The back ring's 1.52 Ω is over the 1.37 Ω of the B32 it is planned onto (BS 7671:2018+A2 Table 41.3, found)
      'bungalow swap-zs-over-new-limit survey.ways.1.readings.zs',
      // The kitchen radial's N–E 0.4 MΩ at 500 V is below Table 64's 1 MΩ (from memory) and will trip its new RCBO
      'bungalow insulation-below-table-64 survey.ways.2.readings.insulation.neutralEarth',
      'bungalow swap-insulation-will-trip-rcd survey.ways.2.readings.insulation.neutralEarth',
    ]);
    const warnings = checkSchedule(byKey.get('flat-main')!.schedule, { today: TODAY }).filter((f) => f.severity === 'warning');
    expect(warnings.map((f) => f.code)).toEqual(['zs-over-rule-of-thumb']); // 1.21 Ω > 0.8 × 1.37 Ω (Table 41.3, IET rule of thumb)
    // The workshop's 6 kA RCBOs sit below its 6.4 kA PFC: a warning to confirm the board's conditional rating (BS 7671 434.5.1, from memory)
    const workshop = checkSchedule(byKey.get('workshop')!.schedule, { today: TODAY }).filter((f) => f.severity === 'warning');
    expect(workshop.map((f) => f.code)).toEqual(['inspection-overdue', 'breaking-capacity-below-pfc']);
  });

  it('when the rear lights record their run buried in insulation, then their capacity is worked from it and still carries the B6', () => {
    const flat = byKey.get('flat-main')!.schedule;
    const index = flat.circuits.findIndex((c) => c.id === 'lights-rear');
    expect(flat.circuits[index].cable).toMatchObject({ liveCsa: 1.5, referenceMethod: '100', insulatedLengthMm: 2000 });
    // 20 A at method C (BS 7671 Table 4D5, found) × 0.5 for 0.5 m or more in insulation (523.9, from memory) = 10 A ≥ 6 A
    const onWay = checkSchedule(flat, { today: TODAY }).filter((f) => f.field?.startsWith(`circuits.${index}.cable`));
    expect(onWay).toEqual([]);
    const onB16 = structuredClone(flat);
    onB16.devices.find((d) => d.id === flat.circuits[index].deviceId)!.rating = 16; // 16 A ≤ 16 A at method 100 (Table 4D5, found), but > 10 A
    const [over] = checkSchedule(onB16, { today: TODAY }).filter((f) => f.code === 'rating-over-iz' && f.ways.includes(7));
    expect(over.message).toContain('10 A capacity of 1.5 mm² twin-and-earth at method C where it is in insulation (method 100 elsewhere) with Ci 0.50');
  });

  it('when the studio board names its feed, then it points at a sub-main circuit on the flat board', () => {
    const studio = byKey.get('flat-studio')!;
    const feeder = byKey.get(studio.feedsFromKey!)!.schedule.circuits.find((c) => c.id === studio.feedsFromCircuitId);
    expect(feeder?.kind).toBe('sub-main');
    for (const c of studio.schedule.circuits) expect(c.locations).toEqual(['Studio']);
  });

  it('when the scenario is read, then the flat has the EV point on 6 mm² SWA and the workshop is three-phase with its machines', () => {
    const ev = byKey.get('flat-main')!.schedule.circuits.find((c) => c.label === 'EV charge point');
    expect(ev?.cable).toMatchObject({ type: 'swa', liveCsa: 6 });
    const workshop = byKey.get('workshop')!.schedule;
    expect(workshop.board.phases).toBe(3);
    for (const label of ['Dust extractor', 'Table saw', 'Compressor', 'Office sockets', 'Workshop lights'])
      expect(workshop.circuits.some((c) => c.label === label)).toBe(true);
  });

  it('when privacy tests need private data, then every private field is filled on every site and board', () => {
    for (const { site, boards: siteBoards } of demoSites) {
      for (const field of ['clientName', 'address', 'clientEmail', 'clientPhone', 'notes'] as const) expect(site[field]).not.toBe('');
      // A private circuit note, or a survey of the old board (never on the board page).
      expect(siteBoards.some((b) => b.schedule.circuits.some((c) => c.notes && !c.notesPublic) || Boolean(b.schedule.survey?.notes))).toBe(true);
      for (const b of siteBoards) expect(b.schedule.board.privateNotes).not.toBe('');
    }
  });

  it('when contact details are read, then they use reserved example domains and drama-range numbers only', () => {
    for (const { site } of demoSites) {
      expect(site.clientEmail).toMatch(/\.example$/); // RFC 2606 reserved domain
      expect(site.clientPhone.replace(/\s/g, '')).toMatch(/^01632960\d{3}$/); // Ofcom drama range 01632 960000–960999
    }
  });
});
