import type { DemoBoardsSeeder } from './index.js';

/** Demo sites and boards (filled in by the board schedule work). */
export const seedDemoBoards: DemoBoardsSeeder = async () => {};
