/*
 * The "Weights" sheet: runs the engine's weight optimiser (JsonFacade.optimize) in a worker of
 * its own, shows progress with Cancel, then a before/after comparison with one click to accept
 * (an undoable edit) or discard. The search runs one engine step per call: "Stop, keep best"
 * ends it after the step in progress with the best weights so far; Cancel terminates the worker.
 * The main worker and the user's work are untouched. Every number shown is the engine's: "before" from its analysis of the same scenario text, "after" from its
 * optimisation result.
 */
(function () {
  "use strict";
  const F = self.SwFormat;
  const A = self.SwApp;
  const $ = function (id) { return document.getElementById(id); };

  const run = {
    task: null,       // EngineTask while running or after a run
    started: 0,
    timer: 0,
    serial: 0,        // which start() the answers belong to
    fromText: null,   // scenario text the search started from
    fromObj: null,    // the same, parsed
    before: null,     // engine analysis of that text
    answer: null,     // the engine's optimisation answer
    stop: false       // "Stop, keep best" pressed: end after the step in progress
  };

  function setNumber(id, v) {
    const el = $(id);
    el.textContent = F.num(v === null || v === undefined ? NaN : v);
    el.dataset.value = v === null || v === undefined ? "" : String(v);
    el.title = v === null || v === undefined ? "none" : String(v);
  }

  function showError(message) {
    const box = $("opt-error");
    box.hidden = !message;
    box.textContent = message || "";
  }

  function options() {
    const o = {};
    const starts = Math.round(Number($("opt-starts").value));
    const seconds = Math.round(Number($("opt-seconds").value));
    if (starts >= 1) o.starts = starts;
    if (seconds >= 1) o.seconds = seconds;
    if ($("opt-tie").checked) o.tie = "literal";
    return o;
  }

  /** The engine's analysis of exactly this text: the shown one when it is current, else asked. */
  function analysisOf(scenarioText) {
    const a = A.analysis();
    if (a && a.text === scenarioText) return Promise.resolve({ ok: true, result: a.result });
    return A.bridge().call("analyze", scenarioText, false);
  }

  function setRunning(on) {
    $("opt-run").disabled = on;
    $("opt-progress").hidden = !on;
    document.body.dataset.optimiser = on ? "running" : (run.answer ? "result" : "idle");
    $("opt-stop").disabled = !on;
    if (on) { run.stop = false; $("opt-stop").hidden = !A.has("optimizeStop"); }
    clearInterval(run.timer);
    if (on) {
      document.body.dataset.optimiserSteps = "0";
      run.timer = setInterval(function () {
        if (document.body.dataset.optimiserSteps !== "0") return; // the live trace line takes over
        $("opt-elapsed").textContent = "searching… " + ((performance.now() - run.started) / 1000).toFixed(1) + " s";
      }, 100);
      $("opt-elapsed").textContent = "searching… 0.0 s";
    }
  }

  function start() {
    if (!A.engineReady()) { showError("The engine has not started yet; try again in a moment."); return; }
    if (!A.has("optimize")) { showError("This build of the engine has no optimiser."); return; }
    cancel(true);
    showError("");
    $("opt-result").hidden = true;
    $("opt-done").hidden = true;
    run.answer = null;
    const serial = ++run.serial;
    const from = run.fromText = A.text();
    run.fromObj = JSON.parse(from);
    const opts = options();
    const optsText = JSON.stringify(opts);
    run.started = performance.now();
    setRunning(true);
    run.task = run.task || A.newTask();
    const task = run.task;
    analysisOf(from).then(function (before) {
      if (serial !== run.serial) return null;
      run.before = before.ok ? before.result : null;
      return stepwise(task, serial, from, optsText);
    }).then(function (answer) {
      if (!answer || serial !== run.serial || answer.cancelled) return;
      const ms = performance.now() - run.started;
      setRunning(false);
      if (!answer.ok) {
        const err = answer.error || {};
        showError("The optimiser could not run: " + (err.message || "unknown problem") + (err.path ? " (at " + err.path + ")" : "") +
          ". Your scenario is unchanged.");
        document.body.dataset.optimiser = "error";
        return;
      }
      run.answer = answer;
      show(answer, ms, optsText);
      document.body.dataset.optimiser = "result";
    });
  }

  /**
   * Runs the engine's stepwise optimiser (optimizeStart / optimizeStep / optimizeFinish: the same
   * loop as optimize) one outer step per call, drawing the trace as it grows; falls back to the
   * one-call optimize when the engine build lacks the steps. Resolves to optimize's answer.
   */
  async function stepwise(task, serial, from, optsText) {
    if (!A.has("optimizeStart")) return task.run("optimize", from, optsText);
    const started = await task.run("optimizeStart", from, optsText);
    if (!started || !started.ok) return started;
    let steps = 0;
    for (;;) {
      const st = await task.run("optimizeStep", started.job, 1);
      if (!st || st.cancelled || serial !== run.serial) return st && st.cancelled ? st : null;
      if (!st.ok) return st;
      steps++;
      showLive(st, steps);
      if (st.done) break;
      if (run.stop && A.has("optimizeStop")) return task.run("optimizeStop", started.job);
    }
    return task.run("optimizeFinish", started.job);
  }

  /** The live trace: the start in progress, its step count and its bound so far. */
  function showLive(st, steps) {
    document.body.dataset.optimiserSteps = String(steps);
    const trace = Array.isArray(st.trace) ? st.trace : [];
    const cv = $("opt-live");
    cv.dataset.trace = JSON.stringify(trace);
    $("opt-elapsed").textContent = "searching… " + ((performance.now() - run.started) / 1000).toFixed(1) + " s · start " +
      (st.start + 1) + ", step " + st.iteration + ", bound " + F.num(st.complexity);
    self.SwCharts.line(cv, [{ label: "bound", points: trace.map(function (v, i) { return [i, v]; }) }],
      { xInteger: true, xLabel: "step", font: A.presenting() ? 15 : 11, lineWidth: A.presenting() ? 3 : 1.8, markerRadius: A.presenting() ? 4.5 : 3 });
  }

  /** Cancel: end the worker (the search is one engine call), keep everything else. */
  function cancel(quiet) {
    if (!run.task || document.body.dataset.optimiser !== "running") { if (!quiet) setRunning(false); return; }
    run.task.cancel();
    run.serial++;
    setRunning(false);
    document.body.dataset.optimiser = "cancelled";
    if (!quiet) { $("opt-elapsed").textContent = ""; showError(""); A.notify("Weight search cancelled. Your scenario is unchanged.", "info"); }
  }

  function statusText(r) {
    const what = { "converged": "converged", "budget-reached": "stopped at its budget", "stalled": "stalled (no further descent found)",
      "cancelled": "stopped by you (the best point found so far; the certificate below holds for it)" }[r.status] || String(r.status);
    return "Search " + what + " after " + F.count(r.iterations) + " iteration" + (r.iterations === 1 ? "" : "s") + " (" +
      F.count(r.evaluations) + " network solves), best of " + F.count(r.starts) + " start" + (r.starts === 1 ? "" : "s") + ".";
  }

  function show(answer, ms, optsText) {
    const r = answer.result;
    const before = run.before;
    $("opt-result").hidden = false;
    $("opt-result").dataset.options = optsText;
    $("opt-result").dataset.ms = String(Math.round(ms));
    $("opt-status").textContent = statusText(r) + " " + F.num(ms / 1000) + " s in the " +
      ((A.bridge() && A.bridge().engine) === "wasm" ? "WebAssembly-GC" : "JavaScript") + " engine" + (r.balanced ? "; weights balanced (W₊ = W₋)." : ".");
    $("opt-status").dataset.status = r.status;
    $("opt-status").dataset.iterations = String(r.iterations);
    $("opt-status").dataset.engine = (A.bridge() && A.bridge().engine) || "";
    if (answer.fallback) $("opt-status").textContent += " Note: " + answer.fallback + ".";
    // The engine's standing of the number searched: not a bound for f when the graph does not decide f.
    const notBound = !!before && before.complexityIsBound === false;
    $("opt-warning").hidden = !notBound;
    $("opt-warning").textContent = notBound ? "The graph does not decide f: the search lowered √(W₊·W₋) of this graph, which is " +
      String(before.complexityNote || "not a bound for f") + ". Fix the reduction before reading these weights as an algorithm for f." : "";
    $("opt-result").dataset.bound = notBound ? "no" : "yes";
    setNumber("opt-before-bound", before ? before.complexity : r.initialComplexity);
    // the engine's analysis: enumerated (positive.maxResistance) or by structure (maxResistance.value)
    setNumber("opt-before-wplus", before && before.positive ? before.positive.maxResistance
      : before && before.maxResistance && before.maxResistance.worst ? before.maxResistance.value : null);
    setNumber("opt-before-wminus", before && before.negative ? before.negative.maxCapacitance
      : before && before.maxCapacitance && before.maxCapacitance.worst ? before.maxCapacitance.value : null);
    setNumber("opt-after-bound", r.complexity);
    setNumber("opt-after-wplus", r.positive && r.positive.maxResistance);
    setNumber("opt-after-wminus", r.negative && r.negative.maxCapacitance);

    const body = $("opt-weights").tBodies[0];
    body.textContent = "";
    const after = r.weights || {};
    (run.fromObj.graph.edges || []).forEach(function (e) {
      const tr = document.createElement("tr");
      tr.dataset.edge = e.id;
      const w0 = e.weight === undefined || e.weight === null ? 1 : e.weight;
      const w1 = after[e.id];
      const cells = [e.id, String(e.when), F.num(w0), "→", F.num(w1)];
      cells.forEach(function (c, i) {
        const td = document.createElement("td");
        td.textContent = c;
        if (i === 2) { td.className = "before"; td.dataset.value = String(w0); }
        if (i === 3) { td.className = "arrow"; td.setAttribute("aria-hidden", "true"); }
        if (i === 4) { td.className = "after"; td.dataset.value = w1 === undefined ? "" : String(w1); }
        tr.appendChild(td);
      });
      if (e.locked) { tr.title = "locked: kept as given"; tr.children[0].textContent = e.id + " (locked)"; }
      body.appendChild(tr);
    });

    const trace = Array.isArray(r.trace) ? r.trace : [];
    $("opt-trace").dataset.trace = JSON.stringify(trace);
    drawTrace();

    const pos = r.positive && r.positive.worst, neg = r.negative && r.negative.worst;
    $("opt-worst").textContent = "Worst inputs with the new weights: " + (pos ? "positive " + pos : "no positive input") + ", " +
      (neg ? "negative " + neg : "no negative input") + ". Each comes with the engine's certificate (a unit flow or a potential).";
    $("opt-note").textContent = r.note ? "Note: " + r.note + "." : "";
    updateActions();
  }

  function drawTrace() {
    const cv = $("opt-trace");
    let trace = [];
    try { trace = JSON.parse(cv.dataset.trace || "[]"); } catch (e) { trace = []; }
    if ($("opt-result").hidden) return;
    self.SwCharts.line(cv, [{ label: "bound", points: trace.map(function (v, i) { return [i, v]; }) }],
      { xInteger: true, xLabel: "iteration", font: A.presenting() ? 15 : 11, lineWidth: A.presenting() ? 3 : 1.8, markerRadius: A.presenting() ? 4.5 : 3 });
  }

  /** Accept is offered only while the scenario is still the one the search started from. */
  function updateActions() {
    const has = !!run.answer && !$("opt-result").hidden;
    const stale = has && A.text() !== run.fromText;
    $("opt-accept").disabled = !has || stale;
    $("opt-discard").disabled = !has;
    $("opt-stale").hidden = !stale || !$("opt-done").hidden;
  }

  function accept() {
    if (!run.answer || A.text() !== run.fromText) { updateActions(); return; }
    let next;
    try { next = JSON.parse(run.answer.scenario); } catch (e) { showError("The engine's optimised scenario was unreadable; nothing was changed."); return; }
    run.accepted = true;
    A.commitScenario(next);
    $("opt-done").hidden = false;
    $("opt-done").textContent = "✓ Accepted: the new weights are in the scenario. Undo (Ctrl+Z) brings the old ones back.";
    run.answer = null;
    document.body.dataset.optimiser = "accepted";
    updateActions();
  }

  function discard() {
    run.answer = null;
    $("opt-result").hidden = true;
    $("opt-done").hidden = true;
    document.body.dataset.optimiser = "discarded";
    A.notify("The optimised weights were discarded; the scenario is as it was.", "info");
  }

  $("opt-run").addEventListener("click", start);
  $("opt-cancel").addEventListener("click", function () { cancel(false); });
  $("opt-stop").addEventListener("click", function () {
    if (document.body.dataset.optimiser !== "running") return;
    run.stop = true;
    $("opt-stop").disabled = true;
    $("opt-elapsed").textContent = "stopping after this step…";
  });
  $("opt-accept").addEventListener("click", accept);
  $("opt-discard").addEventListener("click", discard);
  A.on("scenario", updateActions);
  A.on("mode", function () { drawTrace(); });
  A.on("sheet", function (name) { if (name === "weights") drawTrace(); });
  A.on("engine", function () {
    const ok = A.has("optimize");
    $("opt-run").disabled = !ok || document.body.dataset.optimiser === "running";
    $("opt-run").title = ok ? "Run the engine's weight optimiser on the current scenario" : "This build of the engine has no optimiser";
  });
})();
