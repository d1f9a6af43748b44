"use strict";
// Canvas plots of the bench page: the reel histogram per nominal and the drift lines. No library.
const plots = (() => {
  const ink = { fg: "#f7f3e3", dim: "#b4bfca", line: "#34414e", bar: "#ffd23f", zero: "#8fd3ff" };
  const channelColours = ["#ffd23f", "#8fd3ff", "#6ee7a0", "#ff9f5a", "#d3b0ff", "#ff6b5a", "#f7f3e3"];

  // Sizes the drawing buffer to the element so text stays sharp; returns the context and CSS size.
  function fit(canvas) {
    const dpr = window.devicePixelRatio || 1;
    const w = Math.max(100, canvas.clientWidth), h = Math.max(60, canvas.clientHeight);
    if (canvas.width !== Math.round(w * dpr) || canvas.height !== Math.round(h * dpr)) {
      canvas.width = Math.round(w * dpr); canvas.height = Math.round(h * dpr);
    }
    const g = canvas.getContext("2d");
    g.setTransform(dpr, 0, 0, dpr, 0, 0);
    g.clearRect(0, 0, w, h);
    const px = parseFloat(getComputedStyle(document.documentElement).fontSize) || 20;
    g.font = Math.round(px * 1.25) + "px sans-serif";
    return { g, w, h, px };
  }

  function signed(x, digits) { return (x > 0 ? "+" : x < 0 ? "\u2212" : "") + Math.abs(x).toFixed(digits || 0); }

  // groups: [{ label, values: [ppm...] }]; span: half-width of the axis in ppm; bin: bin width in ppm.
  function histogram(canvas, groups, span, bin) {
    const { g, w, h, px } = fit(canvas);
    const text = px * 1.25, rowH = h / Math.max(1, groups.length);
    const bins = Math.max(10, Math.min(60, Math.round((2 * span) / bin)));
    const width = (2 * span) / bins, bw = (w - 8) / bins;
    groups.forEach((group, row) => {
      const top = row * rowH, base = top + rowH - text - 8;
      const n = new Array(bins).fill(0);
      group.values.forEach((x) => {
        const i = Math.floor((x + span) / width);
        n[Math.max(0, Math.min(bins - 1, i))]++;
      });
      const most = Math.max(1, ...n);
      g.fillStyle = ink.bar;
      n.forEach((k, i) => {
        const bh = (k / most) * (base - top - text - 4);
        if (k > 0) g.fillRect(4 + i * bw + 1, base - bh, Math.max(1, bw - 2), bh);
      });
      g.strokeStyle = ink.line; g.lineWidth = 2;
      g.beginPath(); g.moveTo(4, base + 1); g.lineTo(w - 4, base + 1); g.stroke();
      g.strokeStyle = ink.zero; g.setLineDash([6, 6]);
      g.beginPath(); g.moveTo(w / 2, top + text); g.lineTo(w / 2, base); g.stroke(); g.setLineDash([]);
      g.fillStyle = ink.fg; g.textBaseline = "top";
      g.textAlign = "left"; g.fillText(group.label + "  ·  " + group.values.length + " parts", 6, top);
      g.textAlign = "right"; g.fillText("tallest bar " + most, w - 6, top);
      g.fillStyle = ink.dim; g.textBaseline = "bottom";
      g.textAlign = "left"; g.fillText(signed(-span) + " ppm", 6, top + rowH);
      g.textAlign = "center"; g.fillText("0", w / 2, top + rowH);
      g.textAlign = "right"; g.fillText(signed(span) + " ppm", w - 6, top + rowH);
    });
  }

  // channels: [{ label, points: [{ t: ms, v: ohms }] }]; each line is ppm from its first sample.
  function drift(canvas, channels) {
    const { g, w, h, px } = fit(canvas);
    const text = px * 1.5, left = 6, top = text + 8, bottom = h - text - 6;
    const lines = channels.filter((c) => c.points.length > 0).map((c) => {
      const v0 = c.points[0].v;
      return { label: c.label, pts: c.points.map((p) => ({ t: p.t, y: v0 ? ((p.v - v0) / v0) * 1e6 : 0 })) };
    });
    if (lines.length === 0) return;
    const all = lines.flatMap((l) => l.pts);
    const t0 = Math.min(...all.map((p) => p.t)), t1 = Math.max(t0 + 1000, ...all.map((p) => p.t));
    let lo = Math.min(0, ...all.map((p) => p.y)), hi = Math.max(0, ...all.map((p) => p.y));
    if (hi - lo < 1) { hi += 0.5; lo -= 0.5; }
    const x = (t) => left + ((t - t0) / (t1 - t0)) * (w - 2 * left);
    const y = (v) => bottom - ((v - lo) / (hi - lo)) * (bottom - top);
    g.strokeStyle = ink.line; g.lineWidth = 2;
    g.beginPath(); g.moveTo(left, y(0)); g.lineTo(w - left, y(0)); g.stroke();
    lines.forEach((l, i) => {
      g.strokeStyle = channelColours[i % channelColours.length]; g.lineWidth = 3;
      g.beginPath();
      l.pts.forEach((p, k) => (k === 0 ? g.moveTo(x(p.t), y(p.y)) : g.lineTo(x(p.t), y(p.y))));
      g.stroke();
    });
    g.textBaseline = "top"; g.textAlign = "left";
    const plain = g.font;
    g.font = "bold " + Math.round(px * 1.5) + "px sans-serif";
    let at = left;
    lines.forEach((l, i) => {
      g.fillStyle = channelColours[i % channelColours.length];
      g.fillText(l.label, at, 0); at += g.measureText(l.label).width + 32;
    });
    g.font = plain;
    g.fillStyle = ink.dim; g.textAlign = "right";
    g.fillText(signed(hi, 1) + " ppm", w - left, 0);
    g.textBaseline = "bottom";
    g.fillText(signed(lo, 1) + " ppm  ·  " + ((t1 - t0) / 60000).toFixed(1) + " min", w - left, h);
  }

  return { histogram, drift };
})();
