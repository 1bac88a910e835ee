/**
 * Runs an async computation after the input settles, and drops answers to anything but the
 * newest request, so the screen never shows old numbers beside new inputs.
 */
export function latestOnly<I, O>(compute: (input: I) => Promise<O>, apply: (output: O) => void, delayMs = 120) {
  let timer: ReturnType<typeof setTimeout> | undefined;
  let newest = 0;
  return (input: I) => {
    clearTimeout(timer);
    const ticket = ++newest;
    timer = setTimeout(async () => {
      const output = await compute(input);
      if (ticket === newest) apply(output);
    }, delayMs);
  };
}
