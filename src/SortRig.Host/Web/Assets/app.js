"use strict";
// The bench page. State at load comes from the JSON API, everything after from the server-sent
// event stream. Every request goes to this origin; text from the server is only ever set as text.
const $ = (id) => document.getElementById(id);
const LIVE = new Set(["Accepted", "Announced"]);
const page = {
  session: null,
  parts: new Map(),   // part number -> PartView (/api/parts, or provisional from an announcement)
  logged: new Set(),  // part numbers in #log, in the order this page learned of them
  shown: null,        // part number on the big display
  reject: null,       // label of the reject cup, learned from a Reject announcement
  reading: null,      // latest Reading event, drawn on the next frame
  drift: new Map(),   // channel -> { label, points: [{ t, v }], last }
  finished: false,
  cupsSeen: new Set(), // every cup label shown so far: its tile stays
  sessionAsked: 0,    // when /api/session was last asked while no session was open
  frame: 0,
  driftFrame: 0,
  refresh: 0,
};

const fmt = {
  ohms(v) {
    const x = Number(v);
    if (v === null || v === undefined || Number.isNaN(x)) return "–";
    if (!Number.isFinite(x)) return "over range";
    const [s, p] = Math.abs(x) >= 1e6 ? [1e6, "M"] : Math.abs(x) >= 1e3 ? [1e3, "k"] : [1, ""];
    return (x / s).toFixed(5) + " " + p + "Ω";
  },
  nominal(v) {
    const [s, p] = v >= 1e6 ? [1e6, "M"] : v >= 1e3 ? [1e3, "k"] : [1, ""];
    return parseFloat((v / s).toPrecision(6)) + " " + p + "Ω";
  },
  ppm(d, digits) {
    const x = Number(d);
    if (d === null || d === undefined || !Number.isFinite(x)) return "";
    return (x >= 0 ? "+" : "−") + Math.abs(x).toFixed(digits || 0) + " ppm";
  },
  percent(f) { return parseFloat((f * 100).toPrecision(4)) + " %"; },
};

async function getJson(path) {
  try {
    const r = await fetch(path, { credentials: "same-origin", cache: "no-store" });
    return r.ok ? await r.json() : null;
  } catch { return null; }
}

function setLink(kind, text) { const l = $("link"); l.className = "link " + kind; l.textContent = text; }

function showSession(s) {
  if (!s) return;
  page.session = s;
  document.body.classList.remove("driftonly");
  $("session").textContent = s.name + " · " + fmt.nominal(s.nominal);
  $("setup").textContent = fmt.percent(s.stockTolerance) + " stock → " + fmt.percent(s.matchTolerance)
    + " match · " + s.meter + " · " + s.range + " · NPLC " + s.nplc;
  $("pause").lastChild.textContent = s.paused ? " carry on" : " pause";
  showProgress();
}

// The last check of the check standard (/api/check): its number, sigma score and state; red when out of control.
function showCheck(c) {
  const box = $("check");
  if (!c || c.error) return;
  box.hidden = false;
  box.textContent = "check " + c.seq + ": " + (c.inControl ? "in control" : "OUT OF CONTROL")
    + " (" + c.sigmaScore.toFixed(1) + " σ)" + (c.flagged > 0 ? " · " + c.flagged + " parts flagged" : "")
    + (c.gainPpm != null ? " · gain " + c.gainPpm.toFixed(1) + " ppm" : "");
  box.className = c.inControl ? "" : "alarm";
  $("remeasure-flagged").hidden = !(c.flagged > 0); // offered only while flagged parts wait
}

function showProgress() {
  const s = page.session, n = page.parts.size;
  const planned = s && s.partsPlanned > 0 ? " / " + s.partsPlanned : "";
  $("progress").textContent = n + planned + " parts" + (s && s.paused ? " · PAUSED" : "");
  $("progress").classList.toggle("paused", !!(s && s.paused));
}

function addLog(number, cup, kind, seeded) {
  const li = document.createElement("li");
  li.dataset.part = number; li.dataset.cup = cup ?? ""; li.dataset.state = kind;
  if (seeded) li.dataset.seeded = "true";
  li.textContent = number + ":" + (cup ?? kind);
  $("log").appendChild(li);
  page.logged.add(number);
}

function showCup(number, cup, kind, value, deviation, text) {
  page.shown = number;
  const big = $("cup");
  $("cupbox").classList.remove("undone");
  if (kind === "Unstable") {
    big.textContent = "reseat"; big.className = "unstable";
    $("cuplabel").textContent = "not settled";
  } else {
    big.textContent = cup ?? "?"; big.className = kind === "Reject" ? "reject" : "";
    $("cuplabel").textContent = kind === "Reject" ? "reject cup" : kind === "Repeat" ? "cup, said again" : "cup";
  }
  $("cupnote").textContent = text ?? "";
  $("part").textContent = "part " + number;
  $("value").textContent = fmt.ohms(value);
  $("dev").textContent = fmt.ppm(deviation);
  document.title = (cup ?? kind) + " · part " + number + " · SortRig";
  markUndone();
}

// The part on the big display was taken back: say so where the cup label was.
function markUndone() {
  if (page.shown === null || page.parts.get(page.shown)?.state !== "Undone") return;
  $("cupbox").classList.add("undone");
  $("cuplabel").textContent = "undone · take it out of";
}

function onAnnouncement(e) {
  const n = e.partNumber;
  if (n === null || n === undefined) return;
  if (e.state === "Reject") page.reject = e.cup;
  if (!page.logged.has(n)) addLog(n, e.cup, e.state, false);
  if (!page.parts.has(n)) {
    page.parts.set(n, { number: n, nominal: page.session?.nominal ?? 0, ohms: e.value, deviationPpm: e.deviationPpm,
      cup: e.cup, state: e.state === "Unstable" ? "Unstable" : "Announced" });
  }
  if (e.state === "Repeat" || page.shown === null || n >= page.shown) {
    showCup(n, e.cup, e.state, e.value, e.deviationPpm, e.text);
  }
  drawHistogram(); showProgress();
}

// Cup letters in the order the cups stand on the bench (no I, O or R: R is the reject cup).
const CUP_LETTERS = "ABCDEFGHJKLMNPQSTUVWXYZ";

// Tiles that stay where they are while cups fill: every cup from the first up to the highest seen so far
// (empty ones show 0), a cup emptied by undo keeps its tile, and the reject cup comes last.
function tileOrder(labels) {
  const letters = labels.filter((k) => CUP_LETTERS.includes(k) && k.length === 1);
  const numbers = labels.filter((k) => /^[0-9]+$/.test(k)).map(Number);
  const order = [];
  if (letters.length) {
    const top = Math.max(...letters.map((k) => CUP_LETTERS.indexOf(k)));
    for (let i = 0; i <= top; i++) order.push(CUP_LETTERS[i]);
  }
  if (numbers.length) for (let n = 1; n <= Math.max(...numbers); n++) order.push(String(n));
  labels.filter((k) => !order.includes(k) && k !== "R").sort().forEach((k) => order.push(k));
  if (labels.includes("R")) order.push("R");
  return order;
}

function showCounts(counts) {
  const box = $("counts"); box.textContent = "";
  const last = page.parts.get(page.shown)?.cup;
  Object.keys(counts).forEach((k) => page.cupsSeen.add(k));
  tileOrder([...page.cupsSeen]).forEach((k) => {
    const d = document.createElement("div");
    d.className = "count" + (k === last ? " last" : "") + (k === page.reject || k === "R" ? " rej" : "") + (counts[k] ? "" : " empty");
    d.dataset.cup = k;
    const b = document.createElement("b"), v = document.createElement("span");
    b.textContent = k; v.textContent = counts[k] ?? 0; d.append(b, v); box.appendChild(d);
  });
}

async function refreshParts() {
  const parts = await getJson("/api/parts");
  if (!parts) return;
  page.parts = new Map(parts.map((p) => [p.number, p]));
  document.querySelectorAll("#log li").forEach((li) => {
    const p = page.parts.get(Number(li.dataset.part));
    if (p) li.dataset.stored = p.state;
  });
  markUndone();
  drawHistogram(); showProgress();
  if (page.finished) showSummary();
}
// At most one fetch per 100 ms; a change while a fetch is pending is covered by that fetch.
function scheduleRefresh() {
  if (!page.refresh) page.refresh = setTimeout(() => { page.refresh = 0; refreshParts(); }, 100);
}
