/**
 * Engineering notation alone: reading typed values and writing figures with SI prefixes. A
 * second, light entry to the solver for the browser's first load: the barrel (`index.ts`) also
 * carries the numerics and the document schema (zod), which the sheet page does not run (its
 * analysis runs on the server), and importing a formatter from there put 139 KB of them into
 * the page. eslint keeps value imports of the barrel out of components and editor state.
 */
export { parseValue } from './parse-value';
export { formatEngineering } from './format';
export { SolverError } from './errors';
