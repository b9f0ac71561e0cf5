// The correlation engine: framework-free, shared by the API, the UI, seeders and tests.
export * from './types';
export { checkDefinitionSchema, checkCheckCaseSchema, definitionSchema, checkCaseSchema } from './schema';
export { checkExpression, toTex, symbolTex, ExpressionError, FUNCTIONS } from './expressions';
export { analyseDefinition, DefinitionError, type DefinitionIssue } from './analyse';
export { compileDefinition, compiled, EvaluationError, InputError, type CompiledDefinition } from './compile';
export { validateVersion, ENGINE_VERSION, type ValidationReport, type CaseResult } from './validate';
export { compareDefinitions, grid, type Comparison } from './compare';
export { canonicalJson, contentHash, sha256Hex } from './canonical';
export { brent, interpolate, NoRootError } from './solve';
export { convert } from './units';
