import { describe, expect, it } from 'vitest';
import { scheduleSchema } from '../../shared/schemas/schedule.js';
import { toPublicBoard } from '../../shared/public/board-page.js';
import { searchWays } from '../../shared/public/search.js';
import { dayText } from '../../shared/public/dates.js';
import { demoSites } from '../../server/seed/demo-data.js';
import { markedSchedule } from './public-fixture.js';

const meta = {
  organisation: { name: 'Lanternfield Electrical', contactPhone: '', contactEmail: '' },
  hasLogo: false,
  revision: 3,
  revisionDate: '2026-01-05',
  nextInspectionOn: null,
};
const flat = toPublicBoard(demoSites[0].boards[0].schedule, meta);
const marked = toPublicBoard(scheduleSchema.parse(markedSchedule()), meta);
const labels = (query: string, board = flat) => searchWays(board.ways, query).map((w) => w.label);

describe('board page search', () => {
  it('when a visitor types a location word, then only the ways serving it remain, whatever the case', () => {
    expect(labels('studio')).toEqual(['Garden studio']);
    expect(labels('GARAGE', marked)).toEqual(['Garage sockets']);
    expect(labels('bathroom')).toEqual(['Shower', 'Lights rear']);
  });

  it('when a word is half typed, then ways containing it still show (it works as you type)', () => {
    expect(labels('bath')).toEqual(['Shower', 'Lights rear']);
    expect(labels('kit')).toEqual(['Kitchen sockets', 'Lights rear', 'Smoke and heat alarms']);
  });

  it('when several words are typed, then a way must match every one of them', () => {
    expect(labels('kitchen sockets')).toEqual(['Kitchen sockets']);
    expect(labels('bedroom 2 lights')).toEqual(['Lights rear']);
  });

  it('when the query is empty or punctuation only, then every way shows; a word nothing mentions shows none', () => {
    expect(labels('   ')).toHaveLength(flat.ways.length);
    expect(labels(' , ; ')).toHaveLength(flat.ways.length);
    expect(labels('conservatory')).toEqual([]);
  });

  it('when accents differ, then they are ignored in both directions', () => {
    const ways = [{ ...flat.ways[0], label: 'Café sockets', locations: ['Séance room'] }];
    expect(searchWays(ways, 'cafe').length).toBe(1);
    expect(searchWays(ways, 'SEANCE').length).toBe(1);
  });

  it('when the query is a way number, then that way matches', () => {
    expect(labels('8')).toContain('Garden studio');
  });
});

describe('board page dates', () => {
  it('when a date is shown, then it reads as day, month name and year', () => {
    expect(dayText('2028-09-18')).toBe('18 September 2028');
    expect(dayText('2024-03-01')).toBe('1 March 2024');
    expect(dayText('not a date')).toBe('not a date');
  });
});
