// The benchmark parts' calls to the API as the demo postdoc (`load`: base URL and session headers).

export const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

/** One call; a refusal throws with the API's answer. */
export async function call(load, route, init = {}) {
  const res = await fetch(`${load.base}${route}`, { headers: load.headers, ...init });
  const body = await res.json();
  if (!res.ok) throw new Error(`${route} answered ${res.status}: ${JSON.stringify(body)}`);
  return body;
}

/** The scan once completed; throws if it fails, is cancelled, or takes more than 30 minutes from `since`. */
export async function completed(load, id, since) {
  for (;;) {
    const scan = await call(load, `/scans/${id}`);
    if (scan.status === 'completed') return scan;
    if (scan.status === 'failed' || scan.status === 'cancelled' || Date.now() - since > 1_800_000) throw new Error(`scan ${id} did not complete (${scan.status})`);
    await sleep(500);
  }
}
