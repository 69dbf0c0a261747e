/**
 * Classification of a candidate from its measured features: scores per boundary kind from the
 * signatures in the literature (cold front: Sanders1999, Schultz2005; dryline: Schaefer1986; outflow
 * boundary: Wakimoto1982; sea-breeze front: Miller2003; wind shift: FMH-1 §5.4.6), with the criteria
 * that held and failed written as evidence. Thresholds are common practice, no source.
 */
import type { BoundaryKind, StationMeta } from '../model/index.js';
import type { Features } from './features.js';
import { angularDifferenceDeg } from '../physics/wind.js';

export interface Classification {
  kind: BoundaryKind;
  confidence: number;
  evidence: string[];
  /** Score of every kind, for diagnostics. */
  scores: Record<BoundaryKind, number>;
}

/** Linear ramp 0 → 1 as x goes from a to b (either order). NaN → 0. */
export function ramp(x: number, a: number, b: number): number {
  if (Number.isNaN(x)) return 0;
  const t = (x - a) / (b - a);
  return t <= 0 ? 0 : t >= 1 ? 1 : t;
}

const f1 = (x: number) => (Number.isNaN(x) ? 'n/a' : x.toFixed(1));
const f0 = (x: number) => (Number.isNaN(x) ? 'n/a' : x.toFixed(0));

/**
 * Score each kind in [0, 1] and pick the best. `hemisphere` is +1 north, −1 south: a cold front veers
 * in the north and backs in the south, so turns are compared after multiplying by it.
 */
export function classify(f: Features, meta: StationMeta | undefined, hemisphere: 1 | -1, forceKind?: BoundaryKind): Classification {
  const turn = f.turnDeg * hemisphere; // + = the cold-front sense for this hemisphere
  const absTurn = Math.abs(f.turnDeg);
  const dT = f.tempAdjChangeC;
  const dTd = f.dewpointChangeC;
  const dTh = f.thetaEChangeK;
  const trough = Math.min(ramp(-f.pressureFallBeforeHpa, 0.4, 1.5), ramp(f.pressureRiseAfterHpa, 0.6, 2.0));
  const riseAfter = ramp(f.pressureRise3hHpa, 0.3, 2.0);
  const windy = ramp(Math.min(f.speedBeforeMs, f.speedAfterMs), 1.0, 3.0);
  const veer = ramp(turn, 15, 50) * windy;
  const anyTurn = ramp(absTurn, 25, 60) * windy;
  // θe falls with the cold, dry air even when a diurnal adjustment hides the temperature fall.
  // An adjusted fall must show in something observed (temperature, θe or dew point): under unexpected cloud
  // the diurnal expectation alone can fake a fall of several degrees.
  const observedFall = Math.max(ramp(-f.tempChangeC, 0, 1.5), ramp(-dTh, 1, 3), ramp(-dTd, 0.5, 2));
  const cooling = Math.max(ramp(-dT, 1.0, 4.0) * (0.3 + 0.7 * observedFall), 0.8 * ramp(-dTh, 3, 7) * ramp(-f.tempChangeC, 0, 1.5));
  const warming = ramp(dT, 1.0, 3.5);
  const drying = Math.max(ramp(-dTh, 1.5, 6), ramp(-dTd, 1.0, 4.0));
  const moistening = Math.max(ramp(dTd, 0.5, 3.0), ramp(dTh, 1.5, 6));
  const abrupt = ramp(-f.abruptChangeC, 1.5, 4.0);
  const recovers = ramp(f.recoveryFraction, 0.25, 0.6);
  const jump = ramp(f.pressureJumpHpa, 0.6, 2.0);
  const gusty = ramp(f.gustMaxMs, 10, 18);
  const daytime = Number.isNaN(f.solarHour) ? 0.5 : f.solarHour >= 9.5 && f.solarHour <= 18.5 ? 1 : 0;
  const levelT = ramp(dT, -2.5, -0.5);
  // Dryline (Schaefer1986): moist air ahead (dew point well above freezing; threshold common practice),
  // a wind turning to the dry, westerly side (mirrored south of the equator), by day.
  const westerlyAfter = Number.isNaN(f.windAfterDeg) ? 0.5 : ramp(-angularDifferenceDeg(f.windAfterDeg, hemisphere === 1 ? 250 : 290), -80, -40);
  const moistAhead = ramp(f.dewpointBeforeC, 3, 8);
  const dryline = ramp(-f.dewpointDropMaxC, 4, 8) * levelT * (daytime ? 1 : 0.3) * (1 - 0.7 * trough) * moistAhead * (0.3 + 0.7 * Math.min(westerlyAfter, ramp(turn, 5, 20) + 0.3));
  let onshore = 0;
  if (meta?.coastal && meta.seaBearingDeg !== undefined && !Number.isNaN(f.windAfterDeg)) {
    onshore = ramp(-angularDifferenceDeg(f.windAfterDeg, meta.seaBearingDeg), -75, -40);
  }
  const seaBreeze = (meta?.coastal ? 1 : 0) * daytime * onshore * anyTurn * ramp(-dT, 0.3, 1.5) * ramp(dTd, -1.5, 0) * ramp(f.solarHour, 8.5, 10.5) * (1 - ramp(f.solarHour, 16.5, 18.5)) * (1 - trough);
  const windBack = anyTurn > 0.5 ? ramp(-f.windReturnDeg, -60, -30) : 0;
  const mesohighDecay = ramp(-f.pressureFallAfterPeakHpa, 0.5, 1.5) * jump;
  const outflow = abrupt * Math.max(recovers, windBack, mesohighDecay) * Math.max(jump, gusty, f.convectiveNear ? 1 : 0) * (1 - 0.5 * trough);
  const fallingAfter = ramp(-f.pressureRise3hHpa, 0.5, 2.0);

  // Cold front: cooling that lasts, with evidence beyond temperature (turn, trough/rise, drying).
  // Calm air with no turn is how radiative cooling looks: the commonest false cold front.
  const calmAfter = Number.isNaN(f.speedAfterMs) ? 0 : 1 - ramp(f.speedAfterMs, 1.0, 3.0); // no wind data is not calm
  // A kink in the pressure trace (the 3-h tendency turning upward), not a steady post-frontal rise.
  const kink = ramp(f.pressureRise3hHpa - f.pressureChangeBefore3hHpa, 1.0, 3.0);
  // With neither wind nor pressure reported, a marked θe or dew-point fall is the only other evidence there is.
  const blind = Number.isNaN(f.turnDeg) && Number.isNaN(f.pressureRise3hHpa) ? 1 : 0;
  const beyond = Math.max(veer, 0.9 * trough, 0.8 * Math.min(kink, drying), 0.7 * blind * ramp(-dTh, 4, 8));
  // The front lies where the temperature falls (Sanders1999): a shift hours ahead of the fall is not it.
  const lateOnset = ramp(f.onsetDelayH, 1.5, 2.5);
  const cold = cooling * (0.35 + 0.65 * beyond) * (0.55 + 0.25 * veer + 0.2 * Math.max(trough, riseAfter)) * (1 - 0.8 * recovers) * (0.4 + 0.6 * drying) * (1 - 0.6 * fallingAfter) * (1 - 0.8 * calmAfter * (1 - veer)) * (1 - 0.7 * lateOnset);
  const warmVeer = ramp(turn, 5, 40) * windy;
  // Warm fronts come with cloud and rain that damp the diurnal cycle, so the observed rise counts too.
  const cloudy = ramp(f.depressionBeforeC, 4, 1);
  // Warm fronts are slow: judge them on the short windows and on 3–5 h windows, whichever fits better.
  // θe rises with the warm, moist air even when the diurnal adjustment hides the temperature rise.
  const warmingShort = Math.max(ramp(dT, 1.5, 3.5), 0.8 * cloudy * ramp(f.tempChangeC, 1.5, 3.5), 0.8 * ramp(dTh, 3, 7) * ramp(f.tempChangeC, 0, 1.5));
  const warmingLong = ramp(f.tempAdjChangeLongC, 1.5, 3.5);
  const pressureFalling = ramp(-f.pressureFallBeforeHpa, 0.5, 2.0) * (1 - riseAfter);
  // Warm air arrives on a wind from the equatorward side: southerly in the north, northerly in the south.
  const towardPoleDeg = hemisphere === 1 ? 180 : 0;
  const equatorwardOf = (d: number) => (Number.isNaN(d) ? 0.5 : ramp(-angularDifferenceDeg(d, towardPoleDeg), -110, -60));
  const warmVeerLong = ramp(f.turnLongDeg * hemisphere, 10, 40) * windy;
  const moistShort = Math.min(ramp(dTd, 1.0, 3.0), ramp(dTh, 2, 6) + 0.3);
  const moistLong = ramp(f.dewpointChangeLongC, 1.0, 3.0);
  const warmShort = warmingShort * moistShort * Math.max(warmVeer, pressureFalling) * (0.4 + 0.6 * equatorwardOf(f.windAfterDeg));
  const warmLong = warmingLong * moistLong * Math.max(warmVeerLong, pressureFalling) * (0.4 + 0.6 * equatorwardOf(f.windAfterLongDeg));
  const warm = Math.max(warmShort, 0.9 * warmLong);
  const warmingAny = Math.max(warmingShort, warmingLong);
  // Little change of air mass: little temperature change, or (under a diurnal adjustment that may misjudge
  // a cloudy day) little change of θe.
  const littleChange = (1 - ramp(Math.abs(dTh), 3, 7)) * (1 - ramp(Math.min(Math.abs(dT), Math.abs(f.tempChangeC)), 2, 5));
  const occluded = ramp(absTurn, 30, 60) * windy * Math.max(trough, kink) * littleChange * 0.9;
  // An unclassified wind shift in the FMH-1 §5.4.6 sense: met outright when the raw reports near the anchor
  // hold one by the physics/wind.ts predicate (fmh1WindShifts: ≥ 45° in < 15 min, ≥ 10 kt throughout). Hourly
  // reports can never show "< 15 min", so otherwise it is judged on the mean winds an hour or two each side,
  // graded around the same thresholds (45°, 10 kt ≈ 5.1 m/s; ramp ends common practice, no source).
  const shiftOnMeans = ramp(absTurn, 35, 50) * ramp(Math.min(f.speedBeforeMs, f.speedAfterMs), 3.5, 5.1);
  const shift = 0.6 * (f.fmh1WindShiftNear ? 1 : shiftOnMeans);

  const scores: Record<BoundaryKind, number> = {
    'cold-front': cold,
    'warm-front': warm,
    'occluded-front': occluded,
    dryline,
    'outflow-boundary': outflow,
    'sea-breeze-front': seaBreeze,
    'wind-shift': shift,
  };
  // Specific decoys beat the general kinds when they fit at least as well.
  // A plain wind shift is the fallback: a boundary kind that fits reasonably wins over it.
  let kind: BoundaryKind = 'wind-shift';
  let best = -1;
  for (const k of Object.keys(scores) as BoundaryKind[]) {
    if (k !== 'wind-shift' && scores[k] > best) {
      best = scores[k];
      kind = k;
    }
  }
  if (best < 0.35 && shift > best) kind = 'wind-shift';
  if (outflow >= 0.35 && outflow >= 0.7 * cold) kind = 'outflow-boundary';
  if (seaBreeze >= 0.35 && seaBreeze >= 0.6 * cold) kind = 'sea-breeze-front';
  if (dryline >= 0.4 && dryline >= 0.7 * cold) kind = 'dryline';
  if (forceKind) kind = forceKind;
  const confidence = Math.max(0, Math.min(1, scores[kind]));

  const ev: string[] = [];
  const say = (ok: boolean, text: string) => ev.push(`${ok ? '+' : '−'} ${text}`);
  const sense = hemisphere === 1 ? 'veer' : 'back';
  say(
    veer > 0.5,
    Number.isNaN(f.turnDeg)
      ? 'no wind turn measurable (calm or missing wind)'
      : `wind ${f0(f.windBeforeDeg)}° → ${f0(f.windAfterDeg)}° (${f.turnDeg >= 0 ? 'veering' : 'backing'} ${f0(Math.abs(f.turnDeg))}°${kind === 'cold-front' || kind === 'warm-front' || kind === 'occluded-front' ? `; fronts ${sense} in this hemisphere` : ''})`,
  );
  say(cooling > 0.5 || warming > 0.5, `temperature ${f1(f.tempChangeC)} °C observed, ${f1(dT)} °C after removing the expected diurnal change`);
  say(kind === 'warm-front' ? moistening > 0.5 : drying > 0.5, `dew point ${f1(dTd)} °C, θe ${f1(dTh)} K`);
  say(trough > 0.5, `pressure ${f1(f.pressureFallBeforeHpa)} hPa in 3 h to the minimum, ${f1(f.pressureRiseAfterHpa)} hPa in 3 h after`);
  if (jump > 0.5) say(true, `pressure jump ${f1(f.pressureJumpHpa)} hPa within 30 min`);
  if (abrupt > 0.5) say(true, `abrupt fall ${f1(f.abruptChangeC)} °C within 30 min`);
  if (windBack > 0.5) say(kind !== 'cold-front', `wind back within ${f0(f.windReturnDeg)}° of its earlier direction 1.5–3 h later`);
  if (fallingAfter > 0.5) say(kind !== 'cold-front', `pressure falls ${f1(-f.pressureRise3hHpa)} hPa in the 3 h after`);
  if (f.recoveryFraction > 0.25) say(kind !== 'cold-front', `temperature recovers ${f.recoveryFraction >= 1 ? 'fully' : f0(100 * f.recoveryFraction) + ' %'} within 3 h`);
  if (gusty > 0.5) say(true, `gusts to ${f1(f.gustMaxMs)} m/s`);
  if (kind === 'dryline') say(true, `dew point falls ${f1(-f.dewpointDropMaxC)} °C within 3 h while temperature holds, by day`);
  if (kind === 'sea-breeze-front') say(true, `coastal station, onshore wind after the turn, local solar hour ${f1(f.solarHour)}`);
  if (cooling > 0.5 && calmAfter > 0.5 && veer < 0.5) say(false, 'light or calm wind after, no turn: radiative cooling looks like this');
  if (cooling > 0.5 && lateOnset > 0.5) say(false, `the temperature fall starts ${f1(f.onsetDelayH)} h after this time: the front lies at the fall`);
  if (blind) say(false, 'no wind and no pressure reported: judged on temperature and moisture alone');
  if (cooling > 0.5 && beyond < 0.3) say(false, 'no evidence beyond temperature (no turn, no trough, no drying): likely diurnal or local cooling');
  return { kind, confidence, evidence: ev, scores };
}
