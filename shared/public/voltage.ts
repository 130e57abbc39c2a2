/** The supply voltages now live with the schedule (shared/schedule/voltage.ts), where the print engine and the rules read them too. */
export { supplyVoltages, supplyVoltageText } from '../schedule/voltage.js';
