"use strict";
// The bench page: follows the server-sent event stream and shows the cup in very large type.
const $ = (id) => document.getElementById(id);
const state = { parts: [], counts: {}, nominal: null, done: 0 };

function ohms(v) {
  if (v === null || v === undefined) return "–";
  if (!isFinite(v)) return "OPEN";
  const [s, p] = Math.abs(v) >= 1e6 ? [1e6, "M"] : Math.abs(v) >= 1e3 ? [1e3, "k"] : [1, ""];
  return (v / s).toFixed(5) + " " + p + "Ω";
}
function ppm(d) { return d === null || d === undefined ? "" : (d >= 0 ? "+" : "") + Math.round(d) + " ppm"; }

function showAnnouncement(e) {
  const cup = $("cup");
  cup.textContent = e.state === "Unstable" ? "unstable" : (e.cup ?? "?");
  cup.className = e.state === "Reject" ? "reject" : e.state === "Unstable" ? "unstable" : "";
  $("part").textContent = e.partNumber ? "part " + e.partNumber : "";
  $("value").textContent = ohms(e.value);
  $("dev").textContent = ppm(e.deviationPpm);
  const li = document.createElement("li");
  li.dataset.part = e.partNumber; li.dataset.cup = e.cup ?? ""; li.dataset.state = e.state;
  li.textContent = e.partNumber + ":" + (e.cup ?? e.state);
  $("log").appendChild(li);
  if (e.state !== "Repeat" && e.deviationPpm !== null && e.deviationPpm !== undefined) {
    state.parts.push(e.deviationPpm); drawHistogram();
  }
  if (e.state !== "Repeat") { state.done++; $("progress").textContent = state.done + " parts"; }
}

function showCounts(counts) {
  const box = $("counts"); box.textContent = "";
  Object.keys(counts).sort().forEach((k) => {
    const d = document.createElement("div"); d.className = "count";
    d.innerHTML = "<b></b><span></span>"; d.querySelector("b").textContent = k;
    d.querySelector("span").textContent = counts[k]; box.appendChild(d);
  });
}

function drawHistogram() {
  const c = $("hist"), g = c.getContext("2d"), xs = state.parts;
  g.clearRect(0, 0, c.width, c.height);
  if (xs.length === 0) return;
  const lo = Math.min(...xs), hi = Math.max(...xs), bins = 40, w = (hi - lo) / bins || 1;
  const n = new Array(bins).fill(0);
  xs.forEach((x) => { n[Math.min(bins - 1, Math.floor((x - lo) / w))]++; });
  const top = Math.max(...n), bw = c.width / bins;
  g.fillStyle = "#ffc93c";
  n.forEach((k, i) => { const h = (k / top) * (c.height - 30); g.fillRect(i * bw + 1, c.height - 20 - h, bw - 2, h); });
  g.fillStyle = "#f4f1e8"; g.font = "18px sans-serif";
  g.fillText(Math.round(lo) + " ppm", 4, c.height - 3);
  g.fillText(Math.round(hi) + " ppm", c.width - 90, c.height - 3);
}

function onEvent(e) {
  switch (e.kind) {
    case "Reading":
      $("reading").textContent = ohms(e.value);
      $("settle").textContent = (e.state ?? "") + " " + (e.text ?? "");
      break;
    case "Announcement": showAnnouncement(e); break;
    case "Counts": state.counts = e.counts ?? {}; showCounts(state.counts); break;
    case "Notice": {
      const p = document.createElement("div"); p.textContent = e.text;
      const box = $("notices"); box.appendChild(p);
      while (box.childElementCount > 4) box.removeChild(box.firstChild);
      break;
    }
    case "Finished": $("link").textContent = "finished"; break;
    case "Drift": $("drift").hidden = false; break;
  }
}

async function act(action) {
  await fetch("/api/actions/" + action, { method: "POST", credentials: "same-origin" });
}
document.querySelectorAll("button[data-action]").forEach((b) => b.addEventListener("click", () => act(b.dataset.action)));
document.addEventListener("keydown", (k) => {
  const map = { u: "undo", m: "remeasure", p: "pause", " ": "pause", f: "finish" };
  const a = map[k.key.toLowerCase()]; if (a) { k.preventDefault(); act(a); }
});

fetch("/api/session", { credentials: "same-origin" }).then((r) => r.ok ? r.json() : null).then((s) => {
  if (s) $("session").textContent = s.name ?? "session";
});
const source = new EventSource("/api/events");
source.onopen = () => { $("link").textContent = "live"; };
source.onerror = () => { $("link").textContent = "reconnecting"; };
source.onmessage = (m) => onEvent(JSON.parse(m.data));
