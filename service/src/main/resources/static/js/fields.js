// Every JSON field name of the API that the page reads or writes lives in this module, and every API
// path: the rest of the page works on the plain objects returned here. A renamed field is one edit.
'use strict';

const enc = encodeURIComponent;

/** API paths (relative to the page, so a context path works). */
export const paths = {
  caller: () => 'api/v1/caller',
  plants: () => 'api/v1/plants',
  overview: (plant) => 'api/v1/plants/' + enc(plant) + '/overview',
  samplePoint: (point) => 'api/v1/sample-points/' + enc(point),
  series: (point, q) => 'api/v1/sample-points/' + enc(point) + '/series?' + new URLSearchParams(q),
  limits: (point) => 'api/v1/sample-points/' + enc(point) + '/limits',
  limitHistory: (point, parameter) => 'api/v1/sample-points/' + enc(point) + '/limits/' + enc(parameter) + '/history',
  setLimits: (point, parameter, effectiveFrom, reason) => 'api/v1/sample-points/' + enc(point) + '/limits/' + enc(parameter)
    + '?' + new URLSearchParams(effectiveFrom ? { effectiveFrom, reason } : { reason }),
  findings: (point) => 'api/v1/sample-points/' + enc(point) + '/findings',
  excursions: (q) => 'api/v1/excursions?' + new URLSearchParams(q),
  acknowledge: () => 'api/v1/excursions/acknowledgements',
  events: () => 'api/v1/excursion-events',
  eventEntries: (event) => 'api/v1/excursion-events/' + enc(event) + '/entries',
  curve: () => 'api/v1/chemistry/speciation/curve',
};

/** The problem detail of an error answer. */
export const problemDetail = (j) => (j && (j.detail || j.title)) || '';

/** GET /caller: who the key is and what its role may do. */
export function caller(j) {
  return {
    name: j.name, keyId: j.keyId, role: j.role, read: j.read, acknowledge: j.acknowledge,
    setLimits: j.setLimits, backdateLimits: j.backdateLimits,
  };
}

/** GET /plants */
export const plants = (j) => j.map((p) => ({ id: p.id, name: p.name }));

/** GET /sample-points/{samplePoint}: the configuration the curve needs. */
export function samplePoint(j) {
  return {
    id: j.id, name: j.name, alkalizer: j.alkalizer, regime: j.treatmentRegime, location: j.cycleLocation,
    temperatureCel: j.operatingTemperatureCel, pressureMPa: j.operatingPressureMPa, parameters: j.parameters || [],
  };
}

function finding(f, instant) {
  const e = f.evidence;
  return {
    code: f.code, instant,
    pointsAt: String(f.pointsAt).toLowerCase(),
    explanation: f.explanation,
    evidence: e ? { quantity: e.quantity, unit: e.unit, expected: e.expected, read: e.read, residual: e.residual, tolerance: e.tolerance } : null,
  };
}

/** One sample point of GET /plants/{plant}/overview (also GET /sample-points/{samplePoint}/state). */
export function pointState(s) {
  const ev = s.evaluation ? s.evaluation.evaluation : null;
  const comp = (p) => {
    const c = ev && (ev.compensated || []).find((x) => x.parameter === p);
    return c ? c.at25USPerCm : null;
  };
  const t = ev && ev.phAtTemperature;
  const c = ev && ev.composition;
  const diagnosis = s.diagnosis ? s.diagnosis.findings.map((f) => finding(f, false)) : [];
  const instant = ev ? (ev.findings || []).map((f) => finding(f, true)) : [];
  return {
    id: s.samplePoint, name: s.name, location: s.cycleLocation, regime: s.treatmentRegime, asOf: s.asOf,
    readings: (s.readings || []).map((r) => ({
      parameter: r.parameter, unit: r.unit, time: r.time, ageSeconds: r.ageSeconds, value: r.value, quality: r.quality,
    })),
    levels: (s.levels || []).map((l) => ({
      parameter: l.parameter, level: l.level, since: l.since, value: l.value, unit: l.valueUnit,
      inDoubt: l.instrumentInDoubt, calculated: l.calculatedValue, origin: l.limitsOrigin,
    })),
    evaluated: s.evaluation ? { time: s.evaluation.time, ageSeconds: s.evaluation.ageSeconds } : null,
    at25: { sc: comp('specific_conductivity'), cace: comp('cation_conductivity'), dcace: comp('degassed_cation_conductivity') },
    calculatedPh: ev && ev.calculatedPh ? ev.calculatedPh.rigorous : null,
    phAtT: t ? { ph: t.ph, low: t.low, high: t.high, neutral: t.neutralPh, temperatureCel: t.temperatureCel, pressureMPa: t.pressureMPa, formulation: t.formulation, uncertainty: t.uncertainty || null } : null,
    composition: c ? {
      alkalizerMgPerKg: c.alkalizerMgPerKg, chlorideUgPerKg: c.chlorideEquivalentUgPerKg, carbonDioxideUgPerKg: c.carbonDioxideUgPerKg,
      sodiumUgPerKg: c.sodiumUgPerKg, phosphateMgPerKg: c.phosphateMgPerKg,
    } : null,
    configVersion: ev ? ev.configVersion : null,
    findings: diagnosis.concat(instant.filter((f) => !diagnosis.some((d) => d.code === f.code))),
  };
}

/** GET /plants/{plant}/overview */
export const overview = (j) => ({ plant: j.plant, name: j.name, asOf: j.asOf, points: j.samplePoints.map(pointState) });

/**
 * An overview answered seconds ago, as of now: what a 304 Not Modified means (the API's weak ETag
 * leaves out asOf and the ages, which count from the request). The ages count on from the page's clock.
 */
export function agedOverview(j, seconds) {
  const later = (iso) => iso ? new Date(Date.parse(iso) + seconds * 1000).toISOString() : iso;
  return {
    ...j, asOf: later(j.asOf),
    samplePoints: j.samplePoints.map((s) => ({
      ...s, asOf: later(s.asOf),
      readings: (s.readings || []).map((r) => ({ ...r, ageSeconds: r.ageSeconds + seconds })),
      evaluation: s.evaluation ? { ...s.evaluation, ageSeconds: s.evaluation.ageSeconds + seconds } : s.evaluation,
    })),
  };
}

/** GET /sample-points/{samplePoint}/findings: minutes with their findings. */
export const findingMinutes = (j) => j.minutes.map((m) => ({ time: m.time, findings: m.findings.map((f) => finding(f, false)) }));

/** GET .../series: bucket starts (s since epoch) and min, mean, max; or raw points. */
export function series(j) {
  // lab: the grab and lab results as sent (a measured series only), mapped by entryfields.labPoint
  const out = { unit: j.unit, bucketSeconds: j.bucketSeconds, t: [], mean: [], min: [], max: [], lab: j.labResults || null };
  if (j.buckets) {
    for (const b of j.buckets) {
      out.t.push(Date.parse(b.start) / 1000);
      out.mean.push(b.mean); out.min.push(b.min); out.max.push(b.max);
    }
  } else if (j.points) {
    for (const p of j.points) {
      out.t.push(Date.parse(p.time) / 1000);
      out.mean.push(p.value); out.min.push(p.value); out.max.push(p.value);
    }
  }
  return out;
}

function profile(l) {
  // l: the limits document of a profile
  return {
    parameter: l.parameter, unit: l.unit,
    normal: l.normal ? { low: l.normal.low, high: l.normal.high, source: l.normal.source } : null,
    thresholds: (l.thresholds || []).map((t) => ({ level: t.level, side: t.side, value: t.value, source: t.source })),
    document: l, // kept whole for a change: deadband and persistence go back as they came
  };
}

/** GET /sample-points/{samplePoint}/limits: in force now, per parameter. */
export const limitsNow = (j) => j.map((p) => ({ origin: p.origin, version: p.version, effectiveFrom: p.effectiveFrom, ...profile(p.limits) }));

/** GET .../limits/{parameter}/history: periods (from, limits or null) and stored versions. */
export function limitHistory(j) {
  return {
    periods: j.periods.map((p) => ({ from: p.from ? Date.parse(p.from) / 1000 : -Infinity, limits: p.limits && p.limits.limits ? profile(p.limits.limits) : null, origin: p.limits ? p.limits.origin : null })),
    versions: (j.versions || []).map((v) => ({ version: v.version, effectiveFrom: v.effectiveFrom, reason: v.reason, recordedAt: v.recordedAt, recordedBy: v.recordedBy })),
  };
}

/** The body of PUT .../limits/{parameter}: the document as read, with new values and sources. */
export function limitsBody(current, normalLow, normalHigh, thresholds, source) {
  const d = current.document;
  return {
    ...d,
    normal: { low: normalLow, high: normalHigh, source },
    thresholds: thresholds.map((t) => ({ level: t.level, side: t.side, value: t.value, source })),
  };
}

/** GET /excursions */
export function excursions(j) {
  return j.map((x) => ({
    point: x.samplePoint, parameter: x.parameter, unit: x.valueUnit, start: x.start, end: x.end, open: x.open,
    side: x.side, peak: x.peakValue, peakTime: x.peakTime, highest: x.highestLevel, current: x.currentLevel,
    durationSeconds: x.durationSeconds, allowanceSeconds: x.allowanceSeconds, deadline: x.deadline,
    remainingSeconds: x.timeRemainingSeconds, exceeded: x.allowanceExceeded, inDoubtFraction: x.inDoubtFraction,
    calculatedSamples: x.calculatedSampleCount, limitsOrigin: x.limitsOrigin,
    acknowledgements: (x.acknowledgements || []).map((a) => ({ at: a.at, by: a.keyName, note: a.note })),
  }));
}

/**
 * An excursion list answered seconds ago, as of now: what a 304 Not Modified means (the API's weak
 * ETag leaves out what a running excursion counts up to now). Open excursions' durations count on,
 * their time remaining counts down, from the page's clock.
 */
export function agedExcursions(j, seconds) {
  const s = Math.round(seconds);
  return j.map((x) => !x.open ? x : {
    ...x, durationSeconds: x.durationSeconds + s,
    timeRemainingSeconds: x.timeRemainingSeconds == null ? x.timeRemainingSeconds : Math.max(0, x.timeRemainingSeconds - s),
  });
}

/** POST /excursions/acknowledgements */
export const acknowledgementBody = (x, note) => ({ samplePoint: x.point, parameter: x.parameter, start: x.start, note });

/** GET /excursion-events */
export function events(j) {
  return j.map((e) => ({
    id: e.id, title: e.title, createdAt: e.createdAt, by: e.keyName, status: e.status, cause: e.causeCategory,
    excursions: e.excursions.map((m) => ({ point: m.samplePoint, parameter: m.parameter, start: m.start })),
    entries: e.entries.map((n) => ({ at: n.at, by: n.keyName, status: n.status, cause: n.causeCategory, note: n.note })),
  }));
}

/** POST /excursion-events */
export const eventBody = (title, cause, note, xs) => ({
  title, causeCategory: cause, note, excursions: xs.map((x) => ({ samplePoint: x.point, parameter: x.parameter, start: x.start })),
});

/** POST /excursion-events/{event}/entries */
export const entryBody = (status, cause, note) => ({ status: status || null, causeCategory: cause || null, note });

/**
 * The speciation component of a point's alkalizer. The point's alkalizer is the name of a weak-base
 * component (the service checks it when the plant is declared), and the speciation API names the
 * same component in lower case, so no list is kept here. Null when the point gives no usable name:
 * the caller says the curve is not available rather than drawing another alkalizer's curve.
 */
export const alkalizerComponent = (alkalizer) => {
  const name = typeof alkalizer === 'string' ? alkalizer.trim() : '';
  return /^[A-Za-z][A-Za-z0-9_]*$/.test(name) ? name.toLowerCase() : null;
};

/** POST /chemistry/speciation/curve: water in (component, amount, unit) triples. */
export function curveBody(water, fromCel, toCel, stepCel, pressureMPa) {
  const body = {
    composition: water.filter((w) => w.amount > 0).map((w) => ({ component: w.component, amount: w.amount, unit: w.unit })),
    fromCel, toCel, stepCel,
  };
  if (pressureMPa !== null && pressureMPa !== undefined) body.pressureMPa = pressureMPa;
  return body;
}

/** The curve's rows. */
export function curve(j) {
  return {
    phAt25: j.phAt25Cel,
    rows: j.rows.map((r) => ({ t: r.temperatureCel, ph: r.phAtTemperature.ph, neutral: r.neutralPh, low: r.phAtTemperature.low, high: r.phAtTemperature.high, extrapolated: r.extrapolatedConstant })),
  };
}
