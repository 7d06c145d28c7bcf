/** Number formatting for the report lives in units/ (the one home of number display). */
export { eng, finite, num, pct, pctAbs, sig } from '../../units/display.js';
