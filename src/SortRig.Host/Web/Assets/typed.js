"use strict";
// The entry field for a typed meter (TYPED::profile): shows the session's prompt and sends each line typed here,
// as on the console. Hidden when the session's meter has a link. Text from the server is only ever set as text.
const typed = { prompt: "", busy: false };

async function pollTyped() {
  const t = await getJson("/api/typed");
  const form = $("typed");
  if (!t || !t.active) { form.hidden = true; return false; }
  form.hidden = false;
  if (t.prompt !== typed.prompt) {
    typed.prompt = t.prompt;
    $("typedprompt").textContent = t.prompt;
  }
  return true;
}

// Quick while a typed meter asks for lines; slow otherwise (a linked meter's page never shows the field).
async function typedLoop() {
  const active = await pollTyped();
  setTimeout(typedLoop, active ? 400 : 3000);
}

$("entry").addEventListener("keydown", (k) => k.stopPropagation()); // digits and letters here are not the single-key actions
$("typed").addEventListener("submit", async (e) => {
  e.preventDefault();
  if (typed.busy) return;
  typed.busy = true;
  const line = $("entry").value;
  try {
    const r = await fetch("/api/typed", {
      method: "POST", credentials: "same-origin",
      headers: { "Content-Type": "application/json" },
      body: JSON.stringify({ line }),
    });
    if (r.ok) $("entry").value = "";
  } finally {
    typed.busy = false;
    await pollTyped();
  }
});

typedLoop();
