// The load generator of bench/scale.bench.ts, in a process of its own: asked for a URL, headers, a number of requests
// and how many run at once, it sends them (each waiting for its answer before the next) and replies with the rate.
process.on('message', async (m: { url: string; headers: Record<string, string>; requests: number; concurrency: number }) => {
  let next = 0;
  const started = performance.now();
  try {
    await Promise.all(Array.from({ length: m.concurrency }, async () => {
      while (next < m.requests) {
        next++;
        const res = await fetch(m.url, { headers: m.headers });
        if (!res.ok) throw new Error(`${m.url}: ${res.status}`);
        await res.arrayBuffer();
      }
    }));
    process.send!({ perSecond: m.requests / ((performance.now() - started) / 1000) });
  } catch (error) {
    process.send!({ error: String(error) });
  }
});
