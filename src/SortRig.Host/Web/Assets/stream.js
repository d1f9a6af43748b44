"use strict";
// Follows the event stream, sends the four operator actions (buttons and single keys), starts the page.
function addNotice(text) {
  const box = $("notices"), p = document.createElement("div");
  p.textContent = text; box.prepend(p);
  while (box.childElementCount > 2) box.removeChild(box.lastChild);
}

function onFinished() {
  page.finished = true;
  setLink("done", "finished");
  refreshParts().then(showSummary);
}

function onEvent(e) {
  switch (e.kind) {
    case "Reading": queueReading(e); break;
    case "Announcement": onAnnouncement(e); break;
    case "Counts": showCounts(e.counts ?? {}); scheduleRefresh(); break;
    case "Notice":
      addNotice(e.text ?? ""); getJson("/api/session").then(showSession); scheduleRefresh();
      if (/^(check |re-referenced|\d+ flagged parts measured again|\d+ parts flagged)/.test(e.text ?? "")) {
        getJson("/api/check").then(showCheck);
      }
      break;
    case "Finished": onFinished(); break;
    case "Drift": onDrift(e); break;
  }
}

const actionWords = {
  undo: "undo last", remeasure: "measure again", pause: "pause", finish: "finish",
  "remeasure-flagged": "measure flagged parts again",
};
async function act(action) {
  const b = document.querySelector('button[data-action="' + action + '"]');
  let ok = false, status = "no answer";
  try {
    const r = await fetch("/api/actions/" + action, { method: "POST", credentials: "same-origin" });
    ok = r.ok; status = r.status;
  } catch { /* the host is gone; said below */ }
  b.classList.remove("sent", "failed"); b.classList.add(ok ? "sent" : "failed");
  setTimeout(() => b.classList.remove("sent", "failed"), 1200);
  $("acted").textContent = ok ? actionWords[action] + ": sent" : actionWords[action] + ": refused (" + status + ")";
}

document.querySelectorAll("button[data-action]").forEach((b) => b.addEventListener("click", () => {
  b.blur(); // a focused button would also take the space bar, which means pause
  act(b.dataset.action);
}));
document.addEventListener("keydown", (k) => {
  if (k.ctrlKey || k.metaKey || k.altKey || k.repeat) return;
  const map = { u: "undo", m: "remeasure", p: "pause", " ": "pause", f: "finish", r: "remeasure-flagged" };
  const a = map[k.key.toLowerCase()];
  if (a) { k.preventDefault(); act(a); }
});
window.addEventListener("resize", () => { drawHistogram(); if (page.drift.size) drawDrift(); });

async function start() {
  showSession(await getJson("/api/session"));
  await refreshParts();
  // Parts announced before the page opened, in number order; the stream adds the rest as they come.
  const earlier = [...page.parts.values()].filter((p) => p.state !== "Accepted").sort((a, b) => a.number - b.number);
  earlier.forEach((p) => addLog(p.number, p.cup, p.state === "Unstable" ? "Unstable" : "Cup", true));
  const last = earlier[earlier.length - 1];
  if (last) showCup(last.number, last.cup, last.state === "Unstable" ? "Unstable" : "Cup", last.ohms, last.deviationPpm, "");
  showCounts((await getJson("/api/cups")) ?? {});
  if (page.session?.finished) onFinished();
  const source = new EventSource("/api/events");
  source.onopen = () => { if (!page.finished) setLink("live", "live"); };
  source.onerror = () => { if (!page.finished) setLink("lost", "reconnecting"); };
  source.onmessage = (m) => {
    if (!page.session && Date.now() - page.sessionAsked > 1000) {
      page.sessionAsked = Date.now();
      getJson("/api/session").then(showSession);
    }
    onEvent(JSON.parse(m.data));
  };
}
start();
