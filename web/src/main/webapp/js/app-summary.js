/*
 * Spanwright page: the analysis and the Summary sheet. Sends the scenario to the engine after each
 * edit (progress row with Cancel), then shows the engine's figures, counts, verdict, timing and
 * histogram, or its error with the JSON path at fault. The parts are shared through self.SwPage
 * (see app-state.js).
 */
(function () {
  "use strict";
  const F = self.SwFormat;
  const P = self.SwPage;
  const state = P.state;
  const $ = function (id) { return document.getElementById(id); };

  // ------------------------------------------------------------------ analysis

  let analysisTimer = 0;
  function scheduleAnalysis(delay) {
    clearTimeout(analysisTimer);
    analysisTimer = setTimeout(runAnalysis, delay === undefined ? 250 : delay);
  }

  let progressTimer = 0;
  function runAnalysis() {
    if (!state.bridge || !state.bridge.ready) { scheduleAnalysis(100); return; }
    if (state.job) state.bridge.cancel(state.job);
    const scenarioText = P.text();
    document.body.dataset.analysis = "running";
    $("status").dataset.state = "running";
    $("status").textContent = "analysing…";
    clearTimeout(progressTimer);
    progressTimer = setTimeout(function () { $("progress-row").hidden = false; }, 300);
    const started = performance.now();
    const id = state.bridge.analyze(scenarioText, function (done, total, info) {
      if (id !== state.job) return;
      if (info && info.structure) { P.structureWorking(id, info); return; }   // app-structure.js
      $("progress").max = total || 1;
      $("progress").value = done;
      $("progress-text").textContent = F.count(done) + " / " + F.count(total) + " inputs";
    }, function (m) {
      if (id !== state.job) return;
      state.job = 0;
      clearTimeout(progressTimer);
      $("progress-row").hidden = true;
      if (m.type === "cancelled") { $("status").dataset.state = "cancelled"; $("status").textContent = "cancelled — numbers below are from the last finished analysis"; document.body.dataset.analysis = "cancelled"; return; }
      let answer;
      try { answer = JSON.parse(m.text); } catch (e) { answer = { ok: false, error: { message: "unreadable answer", path: "$" } }; }
      if (m.type === "analysis-error" || !answer.ok) { showAnalysisError(answer.error || {}); return; }
      $("timing").dataset.retried = m.retried ? "true" : "false";
      P.showMethod(m.method, m.methodReason);   // app-structure.js
      if (m.method === "structure") { P.showStructure(answer.result, m, scenarioText); return; }
      showAnalysis(answer.result, m.inputs, m.ms, m.total, performance.now() - started, scenarioText);
    });
    state.job = id;
  }

  $("cancel").addEventListener("click", function () { if (state.job) state.bridge.cancel(state.job); });

  function showAnalysisError(err) {
    const box = $("error-box");
    box.hidden = false;
    box.textContent = "";
    const strong = document.createElement("strong");
    strong.textContent = "The scenario cannot be analysed: ";
    box.appendChild(strong);
    box.appendChild(document.createTextNode(String(err.message || "unknown problem")));
    if (err.path) {
      const p = document.createElement("div");
      p.className = "error-path";
      p.textContent = "where: " + err.path + (err.code ? "  (" + err.code + ")" : "");
      box.appendChild(p);
    }
    $("status").dataset.state = "error";
    $("status").textContent = "not analysed — see the message";
    document.body.dataset.analysis = "error";
    document.body.classList.add("stale");
    state.serial++;
    document.body.dataset.analysisSerial = String(state.serial);
  }

  // ------------------------------------------------------------------ summary

  function setFigure(id, v) {
    const el = $(id);
    el.textContent = F.num(v === null || v === undefined ? NaN : v);
    el.dataset.value = v === null || v === undefined ? "" : String(v);
    el.title = v === null || v === undefined ? "no inputs of this kind" : String(v);
  }

  /** The engine's word on the bound: √(W₊W₋) is no bound for f when the graph does not decide f
   *  (complexityIsBound false, complexityNote the why). The page only shows it. */
  function showBoundStanding(result) {
    const notBound = result.complexityIsBound === false;
    const box = $("sum-bound").parentNode;
    box.dataset.bound = notBound ? "no" : "yes";
    const note = $("sum-bound-note");
    note.hidden = !notBound;
    note.textContent = notBound ? "√(W₊·W₋) is " + String(result.complexityNote || "not a bound for f: the graph does not decide f") + "." : "";
    note.dataset.note = notBound ? String(result.complexityNote || "not a bound for f: the graph does not decide f") : "";
    if (notBound) $("sum-bound").title = note.textContent;
  }

  function showAnalysis(result, inputs, ms, total, wallMs, scenarioText) {
    $("error-box").hidden = true;
    document.body.classList.remove("stale");
    const previousX = state.focus >= 0 && state.analysis ? P.xOf(state.analysis.codes[state.focus]) : null;
    const n = inputs ? inputs.codes.length : 0;
    state.analysis = { result: result, codes: inputs ? inputs.codes : new Int32Array(0), values: inputs ? inputs.values : new Float64Array(0),
      flags: inputs ? inputs.flags : new Uint8Array(0), n: n, nvars: (result.variables || state.scenario.variables).length,
      text: scenarioText };
    const pos = result.positive || {}, neg = result.negative || {};
    setFigure("sum-wplus", pos.count ? pos.maxResistance : null);
    setFigure("sum-wminus", neg.count ? neg.maxCapacitance : null);
    setFigure("sum-bound", result.complexity);
    showBoundStanding(result);
    const counts = $("counts");
    counts.textContent = F.count(result.domainSize !== undefined ? result.domainSize : n) + " inputs in the domain: " +
      F.count(pos.count || 0) + " positive (s and t connected), " + F.count(neg.count || 0) + " negative.";
    const red = result.reduction || {};
    const verdict = $("verdict");
    verdict.textContent = "";
    if (red.correct === null || red.correct === undefined) {
      verdict.dataset.correct = "unchecked";
      verdict.textContent = "No function given: the reduction is not checked.";
    } else if (red.correct) {
      verdict.dataset.correct = "yes";
      verdict.textContent = "✓ The graph decides f: s and t are connected exactly when f(x) = 1, on every input of the domain.";
    } else {
      verdict.dataset.correct = "no";
      const c = red.counterexampleCount || 0;
      verdict.appendChild(document.createTextNode("✗ The graph does not decide f: " + F.count(c) + " counterexample" + (c === 1 ? "" : "s") + ". "));
      (red.counterexamples || []).slice(0, 8).forEach(function (x) {
        const b = document.createElement("button");
        b.className = "linkish";
        b.textContent = typeof x === "string" ? x : (x.x || JSON.stringify(x));
        b.addEventListener("click", function () { P.focusInput(typeof x === "string" ? x : x.x); });
        verdict.appendChild(b);
      });
    }
    $("worst-pos").disabled = !pos.worst;
    $("worst-neg").disabled = !neg.worst;
    const rate = total && ms > 0 ? total / (ms / 1000) : 0;
    const timing = $("timing");
    timing.textContent = F.count(total || n) + " inputs analysed in " + F.num(ms / 1000) + " s (" + F.count(Math.round(rate)) + " inputs/s) by the " + (state.engine === "wasm" ? "WebAssembly-GC" : "JavaScript") + " engine.";
    timing.dataset.ms = String(ms);
    timing.dataset.rate = String(rate);
    timing.dataset.engine = state.engine;
    P.analysisShown(previousX, drawHistogram);
  }

  /** The end of showing an analysis, either method's: status, view, the focus kept where the
   *  previous input still is, the serial and the hooks. {@code extra} runs after the view is built. */
  P.analysisShown = function (previousX, extra) {
    $("status").dataset.state = "ready";
    $("status").textContent = "up to date";
    P.buildView();
    if (extra) extra();
    state.focus = -1;
    const i = previousX === null ? -1 : P.indexOfCode(P.codeOf(previousX));
    if (i >= 0) P.setFocus(i, true); else P.clearFocus();
    state.serial++;
    document.body.dataset.analysis = "ready";
    document.body.dataset.analysisSerial = String(state.serial);
    P.hooks.analysis.forEach(function (h) { h(state.analysis); });
    if (state.firstRenderMs === null) {
      state.firstRenderMs = performance.now();
      document.body.dataset.firstRenderMs = String(Math.round(state.firstRenderMs));
    }
  };

  // ------------------------------------------------------------------ histogram

  /**
   * The histogram the engine computed (result.histogram: for each side min, max and equal-width
   * bin counts over [min, max]); the page only draws it. The counts are also put on the canvas
   * (data-positive, data-negative) and in its text alternative.
   */
  function drawHistogram() {
    const cv = $("histogram");
    const ctx = cv.getContext("2d");
    const a = state.analysis;
    const W = cv.width, H = cv.height;
    ctx.clearRect(0, 0, W, H);
    ctx.font = "12px system-ui, sans-serif";
    if (!a) return;
    const hist = a.result.histogram || {};
    const halves = [{ key: "positive", label: "R (positive)", x0: 0, hatch: false }, { key: "negative", label: "C (negative)", x0: W / 2 + 6, hatch: true }];
    const alt = [];
    halves.forEach(function (h) {
      const side = hist[h.key] || {};
      const counts = Array.isArray(side.counts) ? side.counts.map(Number) : [];
      cv.dataset[h.key] = JSON.stringify(counts);
      const total = counts.reduce(function (p, q) { return p + q; }, 0);
      const span = W / 2 - 12;
      const base = H - 22;
      ctx.fillStyle = "#111";
      const range = counts.length ? (side.min === side.max ? "all " + F.num(side.min) : F.num(side.min) + " … " + F.num(side.max)) : "";
      ctx.fillText(h.label + (counts.length ? ", " + range : ": none"), h.x0, 12);
      alt.push(h.label + ": " + (counts.length ? F.count(total) + " inputs in " + counts.length + " bin" + (counts.length === 1 ? "" : "s") + " over " + range + " (" + counts.join(", ") + ")" : "none"));
      const top = Math.max(1, Math.max.apply(null, counts.concat([0])));
      // One bin (every value equal) is drawn as one narrow bar in the middle.
      const bins = counts.length;
      const w = bins > 1 ? span / bins : span / 20;
      const xStart = bins > 1 ? h.x0 : h.x0 + (span - w) / 2;
      for (let b = 0; b < bins; b++) {
        const bh = (base - 20) * counts[b] / top;
        const x = xStart + b * w;
        ctx.fillStyle = h.hatch ? "#b8620a" : "#1f5fa8";
        ctx.fillRect(x + 1, base - bh, w - 2, bh);
        if (h.hatch && bh > 0) {
          ctx.strokeStyle = "#fff"; ctx.lineWidth = 1;
          for (let yy = base; yy > base - bh; yy -= 5) { ctx.beginPath(); ctx.moveTo(x + 1, yy); ctx.lineTo(x + w - 1, yy - 3); ctx.stroke(); }
        }
      }
      ctx.strokeStyle = "#111";
      ctx.beginPath(); ctx.moveTo(h.x0, base + 0.5); ctx.lineTo(h.x0 + span, base + 0.5); ctx.stroke();
      ctx.fillStyle = "#111";
      if (bins > 1) {
        ctx.fillText(F.num(side.min), h.x0, H - 6);
        const m = F.num(side.max);
        ctx.fillText(m, h.x0 + span - ctx.measureText(m).width, H - 6);
      } else if (bins === 1) {
        const m = F.num(side.min);
        ctx.fillText(m, h.x0 + (span - ctx.measureText(m).width) / 2, H - 6);
      }
    });
    cv.textContent = alt.join("; ");
    cv.setAttribute("aria-label", "Histogram of witness sizes. " + alt.join("; "));
  }

  Object.assign(P, { scheduleAnalysis: scheduleAnalysis, runAnalysis: runAnalysis });
})();
