/**
 * A cross-mapping worker (worker_threads): takes one person at a time with the settings and
 * sends back that person's cross maps (crossMapPerson). Started by ccm-pool.ts.
 */
import { parentPort } from 'node:worker_threads';
import { crossMapPerson, type CrossMapSettings } from '../dynamics/person-cross-maps.js';
import type { PersonSeriesInput } from '../dynamics/types.js';

parentPort?.on('message', (message: { id: number; person: PersonSeriesInput; settings: CrossMapSettings }) => {
  parentPort?.postMessage({ id: message.id, maps: crossMapPerson(message.person, message.settings) });
});
