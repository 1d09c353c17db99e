import { formatNumber } from '../report/format-number.js';
import type { DynamicsResult } from './analyse-dynamics.js';

/** One tidy table: header and formatted rows. */
export interface DynamicsTable {
  file: string;
  description: string;
  header: string[];
  rows: string[][];
}

const flag = (value: boolean | undefined): string => (value === undefined ? '' : value ? '1' : '0');
const n = formatNumber;

/**
 * The tidy CSV tables of a {@link DynamicsResult}, numbers written with `formatNumber` so the same
 * inputs give byte-identical files: per person × variable descriptives (`dynamics-persons.csv`),
 * VAR(1) coefficients per person and pooled (`dynamics-var.csv`), one CCM row per person × pair ×
 * direction (`dynamics-ccm.csv`), the skill curve over library sizes (`dynamics-ccm-skill.csv`)
 * and, when the lag scan ran, the skill over lags (`dynamics-ccm-lags.csv`).
 */
export function dynamicsTables(result: DynamicsResult): DynamicsTable[] {
  const persons: DynamicsTable = {
    file: 'dynamics-persons.csv',
    description: 'Descriptive dynamics per person and variable: level, variability, instability (MSSD) and inertia (lag-1 autocorrelation) over valid lag pairs',
    header: ['person', 'variable', 'bins', 'observed', 'pct_missing', 'mean', 'sd', 'mssd', 'rmssd', 'lag_pairs', 'autocorr_acf', 'autocorr_pearson', 'ready', 'note'],
    rows: result.summaries.map((s) => [
      s.person,
      s.variable,
      String(s.bins),
      String(s.observed),
      n(s.percentMissing),
      n(s.mean),
      n(s.sd),
      n(s.mssd),
      n(s.rmssd),
      String(s.lagPairs),
      n(s.autocorrelationAcf),
      n(s.autocorrelationPearson),
      flag(s.ready),
      s.notes.join('; '),
    ]),
  };
  const varTable: DynamicsTable = {
    file: 'dynamics-var.csv',
    description: 'Within-person VAR(1) of each pair on person-mean-centred series (valid lag pairs only): per person with an intercept, and pooled with person fixed effects',
    header: ['scope', 'person', 'pair', 'outcome', 'predictor', 'estimate', 'se', 't', 'p', 'df', 'lag_pairs', 'persons', 'ready', 'status', 'reason'],
    rows: result.var.map((v) => [
      v.scope,
      v.person,
      `${v.pair[0]}:${v.pair[1]}`,
      v.outcome ?? '',
      v.predictor === undefined ? '' : v.predictor === '(intercept)' ? v.predictor : `${v.predictor}.lag1`,
      n(v.estimate),
      n(v.se),
      n(v.t),
      n(v.p),
      n(v.df),
      String(v.lagPairs),
      n(v.persons),
      flag(v.ready),
      v.status,
      v.reason ?? '',
    ]),
  };
  const ccm: DynamicsTable = {
    file: 'dynamics-ccm.csv',
    description: 'Convergent cross mapping per pair and direction: evidence that `cause` drives `effect` when the effect’s delay embedding cross-maps the cause with a skill that grows with the library and beats surrogates of the cause that keep its autocorrelation',
    header: [
      'scope', 'person', 'cause', 'effect', 'direction', 'status', 'E', 'tau', 'exclusion_radius', 'points', 'rho_lmin', 'rho_lmax', 'delta_rho',
      'surrogate_rho_p95', 'surrogate_delta_p95', 'p_rho', 'p_convergence', 'p_seasonal', 'converges', 'peak_lag', 'verdict', 'surrogates', 'reason',
    ],
    rows: result.ccm.map((c) => [
      c.scope,
      c.person,
      c.cause,
      c.effect,
      `${c.cause} -> ${c.effect}`,
      c.status,
      n(c.E),
      n(c.tau),
      n(c.exclusionRadius),
      String(c.points),
      n(c.rhoAtMin),
      n(c.rhoAtMax),
      n(c.deltaRho),
      n(c.surrogateRhoHigh),
      n(c.surrogateDeltaHigh),
      n(c.pRho),
      n(c.pConvergence),
      n(c.pSeasonal),
      flag(c.converges),
      n(c.peakLag),
      c.verdict ?? '',
      String(c.surrogates),
      c.reason ?? '',
    ]),
  };
  const skill: DynamicsTable = {
    file: 'dynamics-ccm-skill.csv',
    description: 'Cross-map skill over library sizes (mean and 5th/95th percentile over random libraries)',
    header: ['scope', 'person', 'cause', 'effect', 'library_size', 'rho', 'rho_p05', 'rho_p95', 'libraries'],
    rows: result.ccm.flatMap((c) => c.skill.map((p) => [c.scope, c.person, c.cause, c.effect, String(p.librarySize), n(p.rho), n(p.rhoLow), n(p.rhoHigh), String(p.samples)])),
  };
  const scanned = result.ccm.filter((c) => c.lagSkill !== undefined);
  if (scanned.length === 0) return [persons, varTable, ccm, skill];
  const lags: DynamicsTable = {
    file: 'dynamics-ccm-lags.csv',
    description: 'Cross-map skill over lags (Ye et al. 2015): the effect’s state at bin t estimates the cause at bin t + lag; a driver peaks at a negative lag',
    header: ['scope', 'person', 'cause', 'effect', 'lag', 'rho', 'points'],
    rows: scanned.flatMap((c) => (c.lagSkill ?? []).map((l) => [c.scope, c.person, c.cause, c.effect, String(l.lag), n(l.rho), String(l.points)])),
  };
  return [persons, varTable, ccm, skill, lags];
}
