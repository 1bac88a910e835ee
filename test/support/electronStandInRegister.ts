/** Loaded with `node --import` before the built main process: maps `electron` to the stand-in. */
import { register } from 'node:module';

register(new URL('./electronStandInHooks.mjs', import.meta.url), {
  data: { standInUrl: new URL('./electronStandIn.mjs', import.meta.url).href },
});
