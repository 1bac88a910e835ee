/**
 * Node module-resolution hook (registered with `node:module`'s register by
 * electronStandInRegister.ts): `electron` resolves to the recording stand-in, everything else as usual.
 */
let standInUrl = '';

export function initialize(data: { standInUrl: string }): void {
  standInUrl = data.standInUrl;
}

export async function resolve(
  specifier: string,
  context: unknown,
  nextResolve: (specifier: string, context: unknown) => Promise<unknown>,
): Promise<unknown> {
  if (specifier === 'electron') return { url: standInUrl, shortCircuit: true };
  return nextResolve(specifier, context);
}
