// On the web, zod's JSON Schema conversion (to and from) and its `z.compile` fast path stand in here
// (metro.config.js): the app never asks for either in the browser, and they are about 70 KB of every page's
// shared chunk. Each name zod's other modules import is present; calling one says where it went.
const gone = (what) => () => {
  throw new Error(`zod's ${what} is not part of the web build (metro.config.js)`);
};

export const INVALID = Symbol.for('zod.compile.invalid');
export class ZodCompileAsyncError extends Error {}
export class ZodCompileUnsupportedError extends Error {}
export const compile = gone('compile');
export const withParser = gone('withParser');
export const compileFn = gone('compileFn');

export const initializeContext = gone('JSON Schema conversion');
export const handleUnrepresentable = gone('JSON Schema conversion');
export const processSchema = gone('JSON Schema conversion');
export { processSchema as process };
export const extractDefs = gone('JSON Schema conversion');
export const finalize = gone('JSON Schema conversion');
// Called when a schema's `~standard` is read (form resolvers do): they hand back a method that is never called here.
export const createToJSONSchemaMethod = () => gone('toJSONSchema');
export const createStandardJSONSchemaMethod = () => gone('JSON Schema conversion');
export const toJSONSchema = gone('toJSONSchema');
export const fromJSONSchema = gone('fromJSONSchema');
export const aggregateChecks = gone('JSON Schema conversion');
export const allProcessors = {};
export class JSONSchemaGenerator {
  constructor() {
    gone('JSONSchemaGenerator')();
  }
}
