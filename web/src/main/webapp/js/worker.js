/*
 * The engine bridge. All computation runs in one Web Worker built from a Blob URL (the only way
 * a worker starts from file://). The worker receives the TeaVM code as text: the JavaScript
 * engine (always) and the WebAssembly-GC runtime plus module bytes (when present). It prefers
 * WebAssembly-GC and falls back to JavaScript when the browser cannot run it.
 *
 * Messages, page -> worker:
 *   {type:"init", engine:"auto"|"wasm"|"js"}
 *   {type:"call", id, fn, args}                   one engine call (validate, detail, renameVariable, build,
 *                                                 optimize, …); long ones run in a task worker of their own
 *   {type:"analyze", id, scenario, withInputs}    enumeration in steps, with progress
 *   {type:"cancel", id}
 * worker -> page:
 *   {type:"ready", engine, note, loadMs, functions} | {type:"fatal", message}
 *   (functions: the exported engine functions this build has; the page hides what is missing)
 *   {type:"reply", id, text}
 *   {type:"progress", id, processed, total}
 *   {type:"analysis", id, text, inputs, ms, total, method, methodReason} | {type:"analysis-error", id, text} |
 *   {type:"cancelled", id}
 *   {type:"structure", id, total, methodReason}   the engine chose its structural method (startAnalysis said so):
 *                                                 nothing to step, so the bridge runs analyze in a task worker
 *
 * Beyond enumeration the analysis is one engine call (JsonFacade.analyze with the structural engine),
 * so EngineBridge runs it in an EngineTask of its own: the main worker keeps answering (focus, edits),
 * the page shows the elapsed time, and Cancel terminates that task worker (a fresh one starts on the
 * next such analysis). The answer reaches onDone as {type:"analysis", method:"structure", inputs:null}.
 */
(function () {
  "use strict";

  const EXPORTED = ["validate", "analyze", "startAnalysis", "stepAnalysis", "finishAnalysis",
    "cancelAnalysis", "detail", "encodeShare", "decodeShare", "renameVariable", "optimize", "optimizeStart", "optimizeStep", "optimizeFinish", "optimizeStop", "optimizeCancel", "build", "importGraph",
    "bounds", "simulate", "sweepFamilies", "sweepStart", "sweepStep", "sweepFinish", "sweepCancel", "sweepReport", "tikz"];

  /* Runs inside the worker. Written as a function so that its text can go into the Blob. */
  function workerMain(exported) {
    let engine = null;
    let engineName = "";
    let running = null;          // {id, job, cancelled}
    const queue = [];

    function post(msg, transfer) { self.postMessage(msg, transfer || []); }

    function errorText(code, message) {
      return JSON.stringify({ ok: false, error: { code: code, message: message, path: "$" } });
    }

    async function init(preferred) {
      const t0 = performance.now();
      let note = "";
      if (preferred !== "js" && self.__swWasmBase64 && typeof WebAssembly === "object") {
        try {
          const bin = atob(self.__swWasmBase64);
          const bytes = new Uint8Array(bin.length);
          for (let i = 0; i < bin.length; i++) bytes[i] = bin.charCodeAt(i);
          const loaded = await self.TeaVM.wasmGC.load(bytes);
          const ex = loaded.exports;
          const probe = ex.validate("{}");
          if (typeof probe !== "string") throw new Error("the module answered " + typeof probe);
          engine = ex;
          engineName = "wasm";
        } catch (e) {
          note = "WebAssembly-GC is not available here (" + (e && e.message ? e.message : e) + "); using JavaScript.";
        }
      } else if (preferred !== "js") {
        note = "This browser has no WebAssembly; using JavaScript.";
      }
      if (!engine) {
        engine = self.__swJsEngine;
        engineName = "js";
      }
      const functions = exported.filter(function (n) { return typeof engine[n] === "function"; });
      post({ type: "ready", engine: engineName, note: note, loadMs: performance.now() - t0, functions: functions });
      pump();
    }

    function handle(msg) {
      if (msg.type === "call") {
        let text;
        try {
          if (typeof engine[msg.fn] !== "function") throw new Error("this build of the engine has no function " + msg.fn);
          text = engine[msg.fn].apply(null, msg.args);
        } catch (e) {
          text = errorText("engine-failure", "The engine failed in " + msg.fn + ": " + (e && e.message ? e.message : e));
        }
        post({ type: "reply", id: msg.id, text: text });
      } else if (msg.type === "analyze") {
        if (running) { cancelRunning(); }
        startJob(msg);
      } else if (msg.type === "cancel") {
        if (running && running.id === msg.id) { cancelRunning(); post({ type: "cancelled", id: msg.id }); }
      }
    }

    function cancelRunning() {
      try { engine.cancelAnalysis(running.job); } catch (e) { /* nothing to release */ }
      running.cancelled = true;
      running = null;
    }

    function startJob(msg) {
      const t0 = performance.now();
      let started;
      try {
        started = JSON.parse(engine.startAnalysis(msg.scenario));
      } catch (e) {
        post({ type: "analysis-error", id: msg.id, text: errorText("engine-failure", String(e && e.message ? e.message : e)) });
        return;
      }
      if (!started.ok) { post({ type: "analysis-error", id: msg.id, text: JSON.stringify(started) }); return; }
      if (started.method === "structure") {
        post({ type: "structure", id: msg.id, total: started.domainSize, methodReason: started.methodReason });
        return;
      }
      const job = { id: msg.id, job: started.job, cancelled: false, t0: t0, chunk: 1024,
        // rows are listed up to the engine's limit (maxListedInputs, 2^20; docs/scenario-format.md)
        withInputs: msg.withInputs !== false && !(started.maxListedInputs >= 0 && started.domainSize > started.maxListedInputs),
        total: started.domainSize, scenario: msg.scenario, stepped: false, retried: false,
        method: started.method || "enumerate", methodReason: started.methodReason || "" };
      running = job;
      // Small domains are finished in one call; large ones are stepped with progress reports.
      if (job.total <= 4096) { finish(job); return; }
      step(job);
    }

    function step(job) {
      if (job.cancelled || running !== job) return;
      let status;
      try {
        const s0 = performance.now();
        status = JSON.parse(engine.stepAnalysis(job.job, job.chunk));
        job.stepped = true;
        const took = performance.now() - s0;
        // Aim at about 40 ms per step so cancel and quick calls are answered promptly.
        if (took < 20 && job.chunk < (1 << 20)) job.chunk *= 2;
        else if (took > 80 && job.chunk > 64) job.chunk = Math.max(64, Math.floor(job.chunk / 2));
      } catch (e) {
        running = null;
        post({ type: "analysis-error", id: job.id, text: errorText("engine-failure", String(e && e.message ? e.message : e)) });
        return;
      }
      if (!status.ok) { running = null; post({ type: "analysis-error", id: job.id, text: JSON.stringify(status) }); return; }
      post({ type: "progress", id: job.id, processed: status.processed, total: status.total });
      if (!status.done) { setTimeout(function () { pump(); step(job); }, 0); return; }
      finish(job);
    }

    function finish(job) {
      let text;
      try {
        text = engine.finishAnalysis(job.job, job.withInputs);
      } catch (e) {
        running = null;
        post({ type: "analysis-error", id: job.id, text: errorText("engine-failure", String(e && e.message ? e.message : e)) });
        return;
      }
      running = null;
      const ms = performance.now() - job.t0;
      // The input list travels as typed arrays (transferred, not copied); the rest as JSON text.
      let parsed;
      try { parsed = JSON.parse(text); } catch (e) { parsed = null; }
      if ((!parsed || !parsed.ok) && job.stepped && !job.retried) {
        // Defensive: if finishing a stepped job fails inside the engine, analyse the same text
        // again in one call (no progress, same numbers) rather than show no result at all.
        const again = JSON.parse(engine.startAnalysis(job.scenario));
        if (again.ok) { job.job = again.job; job.retried = true; finish(job); return; }
      }
      if (!parsed || !parsed.ok) { post({ type: "analysis-error", id: job.id, text: text }); return; }
      const rows = (parsed.result && parsed.result.inputs) || [];
      const n = rows.length;
      const codes = new Int32Array(n);
      const values = new Float64Array(n);
      const flags = new Uint8Array(n);   // bit0 connected, bit1 f known, bit2 f = 1
      for (let i = 0; i < n; i++) {
        const r = rows[i];
        codes[i] = parseInt(r.x, 2) || 0;
        values[i] = r.value === null || r.value === undefined ? NaN : Number(r.value);
        flags[i] = (r.connected ? 1 : 0) | (r.f === null || r.f === undefined ? 0 : 2) | (r.f === 1 || r.f === true ? 4 : 0);
      }
      if (parsed.result) delete parsed.result.inputs;
      post({ type: "analysis", id: job.id, text: JSON.stringify(parsed), ms: ms, total: job.total, retried: job.retried,
        method: job.method, methodReason: job.methodReason,
        inputs: { codes: codes, values: values, flags: flags } }, [codes.buffer, values.buffer, flags.buffer]);
    }

    function pump() {
      while (engine && queue.length) {
        handle(queue.shift());
      }
    }

    self.onmessage = function (ev) {
      const msg = ev.data;
      if (msg.type === "init") { init(msg.engine); return; }
      queue.push(msg);
      if (engine) pump();
    };
  }

  let workerSource = null;
  function buildWorkerSource() {
    if (workerSource) return workerSource;
    const S = self.SpanwrightSources || {};
    if (!S.js) throw new Error("The page is incomplete: the engine script engine/engine-js.js did not load.");
    const parts = [];
    parts.push("self.__swJsEngine = (function(){\n", S.js, "\n;return {");
    // A function this build of the core does not export is simply absent (typeof never throws).
    parts.push(EXPORTED.map(function (n) { return n + ":(typeof " + n + "===\"function\"?" + n + ":undefined)"; }).join(","));
    parts.push("};})();\n");
    if (S.wasmRuntime && S.wasmBase64) {
      parts.push(S.wasmRuntime, "\n;self.__swWasmBase64 = \"", S.wasmBase64, "\";\n");
    }
    parts.push("(", workerMain.toString(), ")(", JSON.stringify(EXPORTED), ");\n");
    workerSource = URL.createObjectURL(new Blob(parts, { type: "text/javascript" }));
    return workerSource;
  }

  /**
   * The page's handle on the engine: promise-returning calls and analysis jobs with progress.
   */
  function EngineBridge(preferred, onReady, onFatal) {
    this.nextId = 1;
    this.pending = new Map();
    this.jobs = new Map();
    this.engine = "";
    this.functions = [];
    this.ready = false;
    const worker = new Worker(buildWorkerSource());
    this.worker = worker;
    const self_ = this;
    worker.onerror = function (e) {
      // Answer every waiting call, so no promise hangs on a dead worker.
      const why = "The engine stopped: " + (e.message || "worker error");
      self_.pending.forEach(function (p) { p(JSON.stringify({ ok: false, error: { code: "engine-failure", message: why, path: "$" } })); });
      self_.pending.clear();
      onFatal(self_.ready ? why : "The engine could not start: " + (e.message || "worker error"));
    };
    worker.onmessage = function (ev) {
      const m = ev.data;
      if (m.type === "ready") { self_.ready = true; self_.engine = m.engine; self_.functions = m.functions || []; onReady(m); return; }
      if (m.type === "reply") { const p = self_.pending.get(m.id); self_.pending.delete(m.id); if (p) p(m.text); return; }
      const job = self_.jobs.get(m.id);
      if (!job) return;
      if (m.type === "progress") job.onProgress(m.processed, m.total);
      else if (m.type === "structure") self_.runStructure(m, job);
      else { self_.jobs.delete(m.id); job.onDone(m); }
    };
    worker.postMessage({ type: "init", engine: preferred });
  }
  /** The structural analysis of one job, in this bridge's structure task (see the file comment):
   *  onProgress(-1, total, {structure: true, methodReason, started}) once, then onDone. */
  EngineBridge.prototype.runStructure = function (m, job) {
    const self_ = this;
    if (!this.structureTask) this.structureTask = new EngineTask(this.engine || "auto");
    const task = this.structureTask;
    const t0 = performance.now();
    job.structure = true;
    job.onProgress(-1, m.total, { structure: true, methodReason: m.methodReason, started: t0 });
    task.run("analyze", job.scenario, false).then(function (v) {
      if (self_.jobs.get(m.id) !== job || (v && v.cancelled)) return;   // cancelled or replaced
      self_.jobs.delete(m.id);
      const ok = v && v.ok;
      job.onDone({ type: ok ? "analysis" : "analysis-error", id: m.id, text: JSON.stringify(v), ms: performance.now() - t0,
        total: m.total, method: "structure", methodReason: m.methodReason, inputs: null, fallback: v && v.fallback });
    });
  };
  EngineBridge.prototype.call = function (fn) {
    const args = Array.prototype.slice.call(arguments, 1);
    const id = this.nextId++;
    const self_ = this;
    return new Promise(function (resolve) {
      self_.pending.set(id, function (text) {
        let v;
        try { v = JSON.parse(text); } catch (e) { v = { ok: false, error: { code: "bad-answer", message: "The engine's answer was not JSON.", path: "$" } }; }
        resolve(v);
      });
      self_.worker.postMessage({ type: "call", id: id, fn: fn, args: args });
    });
  };
  EngineBridge.prototype.analyze = function (scenarioText, onProgress, onDone) {
    const id = this.nextId++;
    this.jobs.set(id, { onProgress: onProgress, onDone: onDone, scenario: scenarioText });
    this.worker.postMessage({ type: "analyze", id: id, scenario: scenarioText, withInputs: true });
    return id;
  };
  /** Cancels an analysis job at once: its onDone sees {type:"cancelled"} now, and anything the
   *  worker still sends for it (progress, or a result that was already on its way) is dropped. */
  EngineBridge.prototype.cancel = function (id) {
    this.worker.postMessage({ type: "cancel", id: id });
    const job = this.jobs.get(id);
    if (!job) return;
    this.jobs.delete(id);
    // a structural analysis is one engine call: end it by ending its worker
    if (job.structure && this.structureTask && this.structureTask.busy) this.structureTask.cancel();
    job.onDone({ type: "cancelled", id: id });
  };
  EngineBridge.prototype.terminate = function () {
    this.worker.terminate();
    if (this.structureTask) this.structureTask.cancel();
  };
  EngineBridge.prototype.has = function (fn) { return this.functions.indexOf(fn) >= 0; };

  /**
   * A worker of its own for one kind of long engine call (optimise, bounds, simulate, build
   * preview). Such a call is one blocking call inside the engine, so cancelling it means
   * terminating this worker; the main worker (analysis, focus) and the user's work are untouched.
   * The worker is started on first use and again after a cancel.
   */
  function EngineTask(preferred) {
    this.preferred = preferred;
    this.bridge = null;
    this.serial = 0;
    this.busy = false;
    this.cancelled = null;
  }
  EngineTask.prototype.start = function () {
    if (this.bridge) return this.bridge;
    const self_ = this;
    this.bridge = new EngineBridge(this.preferred, function () { /* ready */ }, function () {
      // A dead worker is replaced on the next call.
      if (self_.bridge) { try { self_.bridge.terminate(); } catch (e) { /* gone */ } }
      self_.bridge = null;
    });
    return this.bridge;
  };
  /** Runs fn(args…) in this task's worker. Resolves to the engine's answer, or to
   *  {ok:false, cancelled:true, …} when cancel() ended it first. If the WebAssembly-GC engine
   *  fails inside the call (a trap, not an error answer of the engine), the same call is run
   *  once more in a JavaScript-engine worker; such an answer carries fallback: the failure. */
  EngineTask.prototype.run = function (fn) {
    const args = Array.prototype.slice.call(arguments, 1);
    const bridge = this.start();
    const serial = ++this.serial;
    const self_ = this;
    this.busy = true;
    return new Promise(function (resolve) {
      self_.cancelled = function () {
        resolve({ ok: false, cancelled: true, error: { code: "cancelled", message: "cancelled", path: "$" } });
      };
      const done = function (v) {
        if (serial !== self_.serial) return;   // superseded or cancelled
        self_.busy = false;
        self_.cancelled = null;
        resolve(v);
      };
      bridge.call.apply(bridge, [fn].concat(args)).then(function (v) {
        if (serial !== self_.serial) return;
        const failed = v && !v.ok && v.error && v.error.code === "engine-failure";
        if (!failed || bridge.engine !== "wasm") { done(v); return; }
        if (!self_.js) self_.js = new EngineBridge("js", function () { /* ready */ }, function () { self_.js = null; });
        self_.js.call.apply(self_.js, [fn].concat(args)).then(function (w) {
          if (w && typeof w === "object") w.fallback = "the WebAssembly-GC engine failed (" + v.error.message + "), so the JavaScript engine computed this";
          done(w);
        });
      });
    });
  };
  /** Ends the running call (if any) by terminating the worker. */
  EngineTask.prototype.cancel = function () {
    this.serial++;
    this.busy = false;
    if (this.bridge) { this.bridge.terminate(); this.bridge = null; }
    if (this.js) { this.js.terminate(); this.js = null; }
    const c = this.cancelled;
    this.cancelled = null;
    if (c) c();
  };

  self.SpanwrightEngineBridge = EngineBridge;
  self.SpanwrightEngineTask = EngineTask;
})();
