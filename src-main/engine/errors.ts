/**
 * The one error the engine throws for bad input: it names the parameter, the value it got and
 * what is allowed, so the CLI and the UI can point at the right field.
 */
export class PlanParameterError extends Error {
  readonly parameter: string;
  readonly value: unknown;
  readonly allowed: string;

  constructor(parameter: string, value: unknown, allowed: string, message?: string) {
    super(message ?? `${parameter} must be ${allowed} (got ${formatValue(value)})`);
    this.name = 'PlanParameterError';
    this.parameter = parameter;
    this.value = value;
    this.allowed = allowed;
  }
}

export function formatValue(value: unknown): string {
  if (typeof value === 'string') return JSON.stringify(value);
  if (typeof value === 'number' || typeof value === 'boolean' || value === null || value === undefined) {
    return String(value);
  }
  try {
    return JSON.stringify(value);
  } catch {
    return String(value);
  }
}
