/**
 * The typed texts of a schedule that the print outputs can put on paper, each with its schedule
 * path and the name a warning gives it ("Way 3 label"). The editor turns them into field warnings
 * as the user types; the print engine names the label an undrawable character came from by them.
 */
import type { Schedule } from '../schemas/schedule.js';
import type { Finding } from '../rules/types.js';
import { undrawableMessage } from './undrawable.js';

export interface PrintedText {
  /** Schedule path of the field, as the editor's fields name themselves ("circuits.3.label"). */
  field: string;
  /** What a reader calls it: "Way 3 label", "Board name". */
  label: string;
  text: string;
  ways: number[];
}

/** A finding's `rule`: not a wiring rule but what the printer can do. */
export const PRINT_FONT_RULE = 'Printing fonts';

function boardTexts(s: Schedule): PrintedText[] {
  const b = s.board;
  return [
    { field: 'board.name', label: 'Board name', text: b.name, ways: [] },
    { field: 'board.location', label: 'Board location', text: b.location, ways: [] },
    { field: 'board.alternativeSupply.description', label: 'Alternative supply description', text: b.alternativeSupply.description, ways: [] },
  ];
}

function circuitTexts(s: Schedule): PrintedText[] {
  return s.circuits.flatMap((c, i) => {
    const at = (f: string) => `circuits.${i}.${f}`;
    const way = `Way ${c.way}${c.phase ? ` ${c.phase}` : ''}`;
    const ways = [c.way];
    return [
      { field: at('label'), label: `${way} label`, text: c.label, ways },
      { field: at('description'), label: `${way} description`, text: c.description, ways },
      // The editor edits the rooms as one list field, so their warnings share its path.
      ...c.locations.map((text) => ({ field: at('locations'), label: `${way} location`, text, ways })),
      { field: at('previousReference'), label: `${way} old reference`, text: c.previousReference, ways },
      { field: at('notes'), label: `${way} notes`, text: c.notes, ways },
    ];
  });
}

function deviceTexts(s: Schedule): PrintedText[] {
  return s.devices.map((d, i) => ({ field: `devices.${i}.label`, label: `Device name "${d.label}"`, text: d.label, ways: [] }));
}

function surveyTexts(s: Schedule): PrintedText[] {
  const survey = s.survey;
  if (!survey) return [];
  return [
    { field: 'survey.oldBoard', label: 'Old board', text: survey.oldBoard, ways: [] },
    { field: 'survey.notes', label: 'Survey notes', text: survey.notes, ways: [] },
    ...survey.junctionBoxes.flatMap((j, i) => [
      { field: `survey.junctionBoxes.${i}.name`, label: `Junction box ${j.name}`, text: j.name, ways: [] },
      { field: `survey.junctionBoxes.${i}.location`, label: `Junction box ${j.name} location`, text: j.location, ways: [] },
    ]),
    ...survey.ways.flatMap((w, i) => [
      { field: `survey.ways.${i}.reference`, label: `Old way ${w.reference}`, text: w.reference, ways: [] },
      { field: `survey.ways.${i}.feeds`, label: `Old way ${w.reference} feeds`, text: w.feeds, ways: [] },
      { field: `survey.ways.${i}.notes`, label: `Old way ${w.reference} notes`, text: w.notes, ways: [] },
      ...w.targets.map((t, j) => ({
        field: `survey.ways.${i}.targets.${j}.label`,
        label: `Old way ${w.reference} → way ${t.way} label`,
        text: t.label,
        ways: [],
      })),
    ]),
  ];
}

/** Every non-empty typed text of the schedule that some output prints. */
export function printedTexts(schedule: Schedule): PrintedText[] {
  return [...boardTexts(schedule), ...circuitTexts(schedule), ...deviceTexts(schedule), ...surveyTexts(schedule)].filter((t) => t.text);
}

/**
 * A warning on each field holding a character no printing font draws, naming the characters:
 * the user hears it while typing, not when the labels come off the printer. Never blocks saving.
 */
export function undrawableTextFindings(schedule: Schedule): Finding[] {
  const findings: Finding[] = [];
  for (const t of printedTexts(schedule)) {
    const message = undrawableMessage(t.label, t.text);
    if (message) findings.push({ severity: 'warning', rule: PRINT_FONT_RULE, ways: t.ways, message, code: 'undrawable-characters', field: t.field });
  }
  return findings;
}
