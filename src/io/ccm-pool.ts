import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import { crossMapPerson, type CrossMapSettings, type PersonCrossMaps } from '../dynamics/person-cross-maps.js';
import type { PersonSeriesInput } from '../dynamics/types.js';

const WORKER_SCRIPT = new URL('./ccm-worker.js', import.meta.url);

/** Work (crossMapWork units) below which `auto` uses no worker: starting threads would cost more than they save (about 2 s of work). */
export const AUTO_CROSS_MAP_MIN_WORK = 7e7;

/** Threads for `auto`: one per core, at most 4, when there are two persons or more and enough work; otherwise none. */
export function autoCrossMapWorkers(persons: number, work: number, cores = availableParallelism()): number {
  if (persons < 2 || cores < 2 || work < AUTO_CROSS_MAP_MIN_WORK) return 0;
  return Math.min(cores, 4, persons);
}

/** Whether the compiled worker script is there (it is not when running from the TypeScript sources, as in unit tests). */
export function crossMapWorkersAvailable(): boolean {
  return existsSync(fileURLToPath(WORKER_SCRIPT));
}

/**
 * Cross maps every person ({@link crossMapPerson}), in `workers` worker threads (one person at a
 * time each, the next person to the first free thread) or, with 0 workers or without the compiled
 * worker script, in this thread, one person per turn of the event loop so progress can be shown.
 * Results come back in `persons` order and are the same for any number of threads (each
 * direction has its own random streams). `onPerson(done, total)` is called after each person.
 */
export async function crossMapPersons(
  persons: readonly PersonSeriesInput[],
  settings: CrossMapSettings,
  workers: number,
  onPerson?: (done: number, total: number) => void,
): Promise<PersonCrossMaps[]> {
  const results = new Array<PersonCrossMaps>(persons.length);
  let done = 0;
  if (workers <= 0 || !crossMapWorkersAvailable()) {
    for (let i = 0; i < persons.length; i++) {
      await new Promise((resolve) => setImmediate(resolve));
      results[i] = crossMapPerson(persons[i] as PersonSeriesInput, settings);
      onPerson?.(++done, persons.length);
    }
    return results;
  }
  const threads = Array.from({ length: Math.min(workers, persons.length) }, () => new Worker(WORKER_SCRIPT));
  let next = 0;
  try {
    await Promise.all(
      threads.map(
        (thread) =>
          new Promise<void>((resolve, reject) => {
            const give = (): void => {
              if (next >= persons.length) return resolve();
              const id = next++;
              thread.postMessage({ id, person: persons[id], settings });
            };
            thread.on('message', ({ id, maps }: { id: number; maps: PersonCrossMaps }) => {
              results[id] = maps;
              onPerson?.(++done, persons.length);
              give();
            });
            thread.on('error', reject);
            give();
          }),
      ),
    );
  } finally {
    await Promise.all(threads.map((thread) => thread.terminate()));
  }
  return results;
}
