import Ajv2020, { type ErrorObject } from 'ajv/dist/2020';
import definitionSchema from '@/validation/definition.schema.json';
import checkCaseSchema from '@/validation/check-case.schema.json';
import templateSchema from '@/validation/template.schema.json';

export interface SchemaIssue {
  /** JSON pointer into the document, e.g. /inputs/0/unit. */
  pointer: string;
  message: string;
}

const ajv = new Ajv2020({ allErrors: true, strict: false, discriminator: true });
const validateDefinition = ajv.compile(definitionSchema);
const validateCheckCase = ajv.compile(checkCaseSchema);
const validateTemplate = ajv.compile(templateSchema);

function describe(e: ErrorObject): string {
  const p = e.params as Record<string, unknown>;
  switch (e.keyword) {
    case 'required': return `"${p.missingProperty}" is required here`;
    case 'additionalProperties': return `"${p.additionalProperty}" is not a field of this object (check the spelling)`;
    case 'enum': return `must be one of: ${(p.allowedValues as unknown[]).map((v) => JSON.stringify(v)).join(', ')}`;
    case 'const': return `must be ${JSON.stringify(p.allowedValue)}`;
    case 'type': return `must be a ${String(p.type).replace(',', ' or a ')}`;
    case 'pattern':
      if (e.instancePath.endsWith('/doi')) return 'must be a DOI such as 10.1115/1.3450967 (without the https://doi.org/ part)';
      return 'must be an identifier: a letter, then letters, digits or _ (at most 32 characters), e.g. Re_D';
    case 'minLength': return p.limit === 1 ? 'must not be empty' : `must have at least ${p.limit} characters`;
    case 'maxLength': return `must have at most ${p.limit} characters`;
    case 'minItems': return `needs at least ${p.limit} item${p.limit === 1 ? '' : 's'}`;
    case 'maxItems': return `may have at most ${p.limit} items`;
    case 'anyOf':
      if (e.schemaPath.includes('limit')) return 'a validity limit needs a min, a max, or both';
      if (e.schemaPath.includes('tolerance')) return 'a tolerance needs rel (relative), abs (absolute), or both';
      return 'does not match any allowed form';
    case 'discriminator': {
      const options = JSON.stringify((e.parentSchema as { oneOf?: unknown } | undefined)?.oneOf ?? '');
      if (options.includes('choiceStep')) return 'step "kind" must be "correlation", "expression" or "choice"';
      if (options.includes('correlationStep')) return 'an option\'s step "kind" must be "correlation" or "expression"';
      return 'step "kind" must be "expression", "solve" or "table"';
    }
    case 'minimum': return `must be at least ${p.limit}`;
    case 'maximum': return `must be at most ${p.limit}`;
    default: return e.message ?? 'is not valid';
  }
}

function toIssues(errors: ErrorObject[] | null | undefined): SchemaIssue[] {
  const seen = new Set<string>();
  const out: SchemaIssue[] = [];
  // An anyOf failure already says what is needed; its branches' own errors would only repeat it.
  const anyOfAt = new Set((errors ?? []).filter((e) => e.keyword === 'anyOf').map((e) => e.instancePath));
  for (const e of errors ?? []) {
    if (e.schemaPath.includes('/anyOf/') && anyOfAt.has(e.instancePath)) continue;
    // "if/then" and "oneOf" wrappers repeat what their branches already said.
    if (e.keyword === 'if' || e.keyword === 'oneOf') continue;
    const issue = { pointer: e.instancePath || '/', message: describe(e) };
    const key = `${issue.pointer} ${issue.message}`;
    if (!seen.has(key)) { seen.add(key); out.push(issue); }
  }
  return out;
}

/** Every schema problem of a definition, by JSON pointer, in a methods engineer's words. */
export function checkDefinitionSchema(definition: unknown): SchemaIssue[] {
  return validateDefinition(definition) ? [] : toIssues(validateDefinition.errors);
}

export function checkCheckCaseSchema(checkCase: unknown): SchemaIssue[] {
  return validateCheckCase(checkCase) ? [] : toIssues(validateCheckCase.errors);
}

/** Every schema problem of a calculation template's definition. */
export function checkTemplateSchema(definition: unknown): SchemaIssue[] {
  return validateTemplate(definition) ? [] : toIssues(validateTemplate.errors);
}

export { definitionSchema, checkCaseSchema, templateSchema };
