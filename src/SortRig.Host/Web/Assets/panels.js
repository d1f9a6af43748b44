"use strict";
// Panels of the bench page fed by app.js: the live reading, the histogram, the summary, drift.
const settleWords = {
  Empty: ["fixture empty", ""], Bouncing: ["contact bouncing", "busy"], Settling: ["settling", "busy"],
  Accepted: ["accepted", "good"], AwaitingRemoval: ["take the part out", "out"], Removed: ["removed", ""],
  Unstable: ["not settled", "bad"],
};

function queueReading(e) {
  page.reading = e;
  if (!page.frame) page.frame = requestAnimationFrame(drawReading);
}

function drawReading() {
  page.frame = 0;
  const e = page.reading;
  if (!e) return;
  const open = !Number.isFinite(Number(e.value)) && (e.state === "Empty" || e.state === "Removed");
  $("reading").textContent = open ? "no part" : fmt.ohms(e.value);
  $("readingdev").textContent = fmt.ppm(e.deviationPpm);
  const [word, tone] = settleWords[e.state] ?? [e.state ?? "", ""];
  const s = $("settle"); s.textContent = word; s.className = "settle " + tone;
  $("settledetail").textContent = e.text ?? "";
}

function drawHistogram() {
  const s = page.session;
  const live = [...page.parts.values()].filter((p) => LIVE.has(p.state) && Number.isFinite(Number(p.deviationPpm)));
  const byNominal = new Map();
  live.forEach((p) => {
    const k = p.nominal || s?.nominal || 0;
    if (!byNominal.has(k)) byNominal.set(k, []);
    byNominal.get(k).push(Number(p.deviationPpm));
  });
  if (byNominal.size === 0 && s) byNominal.set(s.nominal, []);
  const span = s ? s.stockTolerance * 1e6 : Math.max(100, ...live.map((p) => Math.abs(Number(p.deviationPpm))));
  const bin = s ? s.matchTolerance * 1e6 : span / 10;
  const groups = [...byNominal.entries()].sort((a, b) => a[0] - b[0]).map(([k, v]) => ({ label: fmt.nominal(k), values: v }));
  $("histcaption").textContent = "reel: deviation from nominal · one bar = " + Math.round(bin) + " ppm";
  plots.histogram($("hist"), groups, span, bin);
}

function signedPpm(x) { return (x >= 0 ? "+" : "−") + Math.abs(Math.round(x)); }

function showSummary() {
  const parts = [...page.parts.values()];
  const live = parts.filter((p) => LIVE.has(p.state) && p.cup);
  const byCup = new Map();
  live.forEach((p) => { if (!byCup.has(p.cup)) byCup.set(p.cup, []); byCup.get(p.cup).push(Number(p.deviationPpm)); });
  const body = document.querySelector("#summarytable tbody"); body.textContent = "";
  [...byCup.keys()].sort().forEach((cup) => {
    const xs = byCup.get(cup), lo = Math.min(...xs), hi = Math.max(...xs);
    const tr = document.createElement("tr");
    [cup, String(xs.length), signedPpm(lo), signedPpm(hi), Math.round(hi - lo).toString()].forEach((t) => {
      const td = document.createElement("td"); td.textContent = t; tr.appendChild(td);
    });
    body.appendChild(tr);
  });
  const count = (state) => parts.filter((p) => p.state === state).length;
  $("totals").textContent = live.length + " parts in cups · " + count("Unstable") + " not settled · " + count("Undone") + " undone";
  $("summary").hidden = false;
  $("cupbox").hidden = true;
}

function onDrift(e) {
  const channel = e.partNumber ?? 0;
  let c = page.drift.get(channel);
  if (!c) { c = { label: "ch " + channel, points: [] }; page.drift.set(channel, c); }
  const v = Number(e.value), t = Date.parse(e.time);
  if (Number.isFinite(v) && Number.isFinite(t)) {
    c.points.push({ t, v });
    if (c.points.length > 4000) c.points.splice(0, c.points.length - 4000);
  }
  c.last = e;
  $("drift").hidden = false;
  if (!page.session) {
    document.body.classList.add("driftonly");
    $("session").textContent = "drift log";
  }
  if (!page.driftFrame) page.driftFrame = requestAnimationFrame(drawDrift);
}

function drawDrift() {
  page.driftFrame = 0;
  const body = document.querySelector("#drifttable tbody"); body.textContent = "";
  const channels = [...page.drift.entries()].sort((a, b) => a[0] - b[0]).map(([, c]) => c);
  channels.forEach((c) => {
    const first = c.points[0]?.v, last = c.last;
    const since = first ? ((Number(last.value) - first) / first) * 1e6 : null;
    const tr = document.createElement("tr");
    [c.label, fmt.ohms(last.value), since === null ? "" : fmt.ppm(since, 1) + " since start", last.text || last.state || ""]
      .forEach((t) => { const td = document.createElement("td"); td.textContent = t; tr.appendChild(td); });
    body.appendChild(tr);
  });
  plots.drift($("driftplot"), channels);
}
