/*
 * Pieces shared by the result sheets that run a long engine call (bounds, algorithm run): element
 * creation, the progress row with Cancel, the error box, the "not in this build" note, and the
 * engine's error envelope as one readable line. Text only (textContent), never HTML.
 */
(function () {
  "use strict";

  function el(tag, cls, text) {
    const e = document.createElement(tag);
    if (cls) e.className = cls;
    if (text !== undefined) e.textContent = text;
    return e;
  }

  /** A hidden progress row (indeterminate bar, elapsed text, Cancel) with ids prefix-progress,
   *  prefix-elapsed, prefix-cancel. */
  function progressRow(prefix, label, onCancel) {
    const prog = el("div", "progress-row");
    prog.id = prefix + "-progress";
    prog.hidden = true;
    const bar = el("progress");
    bar.setAttribute("aria-label", label);
    prog.appendChild(bar);
    const t = el("span");
    t.id = prefix + "-elapsed";
    prog.appendChild(t);
    const cancel = el("button", "", "Cancel");
    cancel.id = prefix + "-cancel";
    cancel.addEventListener("click", onCancel);
    prog.appendChild(cancel);
    return prog;
  }

  function errorBox(id) {
    const err = el("div", "error-box");
    err.id = id;
    err.setAttribute("role", "alert");
    err.hidden = true;
    return err;
  }

  /** Replaces a sheet body by a note that this engine build lacks the function. */
  function unavailable(bodyId, noteId, text) {
    const body = document.getElementById(bodyId);
    body.textContent = "";
    const p = el("p", "sheet-intro", text);
    p.id = noteId;
    body.appendChild(p);
  }

  /** "message (at path)" from an engine error envelope. */
  function problem(answer) {
    const err = (answer && answer.error) || {};
    return (err.message || "unknown problem") + (err.path ? " (at " + err.path + ")" : "");
  }

  /** Starts an elapsed-time ticker on the element with this id; returns a stop function. */
  function ticker(id, verb, started, after) {
    const t = setInterval(function () {
      const s = (performance.now() - started) / 1000;
      if (s >= (after || 0)) {
        const row = document.getElementById(id).parentNode;
        row.hidden = false;
        document.getElementById(id).textContent = verb + "… " + s.toFixed(1) + " s";
      }
    }, 100);
    return function () { clearInterval(t); };
  }

  self.SwSheet = { el: el, progressRow: progressRow, errorBox: errorBox, unavailable: unavailable, problem: problem, ticker: ticker };
})();
