// `npm run bench -- constraints`: what the data allow for two published families, computed the
// way a group computes them: exact-method (mode equations) grid scans through the API, the queue
// and the workers, then each scan's parameter constraints and the evidence ratio under every
// built-in likelihood set, read from the API. Figures only; the tests assert the statistics.

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));
const N_STAR = { kind: 'range', parameter: 'nStar', min: 50, max: 60, count: 11, spacing: 'linear' };
const SCANS = [
  {
    label: 'α-attractor T-model (n = 1), log α × N_*', axis: 'alpha',
    body: {
      name: 'benchmark: T-model over α × N_*, exact', model: { kind: 'family', family: 'alpha-t' },
      axes: [{ kind: 'range', parameter: 'alpha', min: 0.01, max: 100, count: 33, spacing: 'log' }, N_STAR],
    },
  },
  {
    label: 'φ^p, p × N_*', axis: 'p',
    body: {
      name: 'benchmark: φ^p over p × N_*, exact', model: { kind: 'family', family: 'monomial' },
      axes: [{ kind: 'range', parameter: 'p', min: 0.5, max: 4, count: 36, spacing: 'linear' }, N_STAR],
    },
  },
];

const sig = (x) => (Math.abs(x) >= 1000 || Math.abs(x) < 0.01 ? x.toExponential(2) : x.toPrecision(3));
function interval(i) {
  if (!i) return '—';
  if (i.kind === 'upper-limit') return `< ${sig(i.upper)}`;
  if (i.kind === 'lower-limit') return `> ${sig(i.lower)}`;
  return `[${sig(i.lower)}, ${sig(i.upper)}]`;
}

async function getJson(url, headers) {
  const res = await fetch(url, { headers });
  const body = await res.json();
  if (!res.ok) throw new Error(`${url} answered ${res.status}: ${JSON.stringify(body)}`);
  return body;
}

async function computeScan({ base, headers }, body) {
  const started = Date.now();
  const res = await fetch(`${base}/scans`, { method: 'POST', headers, body: JSON.stringify({ groupId: 1, pivot: { kind: 'fixed' }, method: 'exact', ...body }) });
  const created = await res.json();
  if (res.status !== 201) throw new Error(`the scan was refused (${res.status}): ${JSON.stringify(created)}`);
  let scan;
  do {
    await sleep(1000);
    scan = await getJson(`${base}/scans/${created.id}`, headers);
  } while (scan.status !== 'completed' && scan.status !== 'failed' && Date.now() - started < 1_800_000);
  if (scan.status !== 'completed') throw new Error(`the scan did not complete (${scan.status})`);
  return { scan, seconds: (Date.parse(scan.finishedAt) - started) / 1000 };
}

export async function benchConstraints(load) {
  const { base, headers } = load;
  const sets = (await getJson(`${base}/likelihood-sets`, headers)).filter((set) => set.builtIn);
  let report = `\nconstraints: exact-method grid scans through ${load.workers} workers, judged under each built-in set\n`;
  const computed = [];
  for (const { label, axis, body } of SCANS) {
    const { scan, seconds } = await computeScan(load, body);
    computed.push({ label, axis, scan });
    report += `  ${label}: ${scan.totalPoints} points in ${seconds.toFixed(1)} s (${scan.donePoints} ok, ${scan.failedPoints} failed)\n`;
  }
  for (const { label, axis, scan } of computed) {
    report += `\n  ${label}, priors from the axes\n`;
    for (const set of sets) {
      const c = await getJson(`${base}/scans/${scan.id}/constraints?likelihood=${set.key}@${set.version}`, headers);
      const of = (name) => c.constraints.find((x) => x.axis === name);
      const at = (name, level) => of(name)?.intervals.find((i) => i.level === level);
      const fit = c.bestFit;
      report +=
        `    ${set.key.padEnd(14)} ${axis} 68 % ${interval(at(axis, 0.68)).padEnd(18)} 95 % ${interval(at(axis, 0.95)).padEnd(18)}` +
        `N_* 68 % ${interval(at('nStar', 0.68)).padEnd(14)} 95 % ${interval(at('nStar', 0.95)).padEnd(14)}` +
        `best fit ${axis} = ${sig(fit.inputs[axis])}, N_* = ${sig(fit.inputs.nStar)}, Δχ² = ${fit.deltaChi2.toFixed(2)}; ` +
        `ln Z = ${c.evidence.lnZ.toFixed(3)} ± ${c.evidence.lnZError.toExponential(1)}; ${c.excluded.count} points left out\n`;
      for (const name of [axis, 'nStar']) if (of(name)?.edgeWarning) report += `${' '.repeat(19)}${of(name).edgeWarning}\n`;
    }
  }
  const [tModel, monomial] = computed;
  const comparison = await getJson(
    `${base}/scans/evidence?ids=${tModel.scan.id},${monomial.scan.id}&likelihoods=${sets.map((s) => `${s.key}@${s.version}`).join(',')}&reference=${monomial.scan.id}`,
    headers,
  );
  report += `\n  evidence ratio, T-model against φ^p (reference), over the axes above\n`;
  for (const entry of comparison.sets) {
    const t = entry.scans.find((s) => s.scanId === tModel.scan.id);
    report += `    ${entry.likelihood.key.padEnd(14)} ln B = ${t.lnB.toFixed(2)} (2 ln B = ${t.twoLnB.toFixed(2)}): ${t.verdict}\n`;
  }
  report += `  ${comparison.note}\n`;
  process.stdout.write(report);
}
