"use client";
/**
 * The geometry view (loaded on demand, with its chart library): the run to scale, typed in or dragged; a
 * slider and a play button that move it through the input's travel; the charts; each member's worst load
 * and where; what is still to enter. Edits go to the store's geometry (saved with the graph).
 */
import { useEffect, useMemo, useRef, useState } from "react";
import { DEFAULT_SETTINGS, sweepGraph } from "@/shared/analysis";
import { mu } from "@/shared/analysis/motion";
import { senseReversed, type SenseSummary } from "@/shared/analysis/motion/types";
import { emptyGeometry, geometrySchema, type LinkageGeometry, type PartGeometry } from "@/shared/linkage/geometry";
import { chainGeometry } from "@/shared/demo-geometry";
import { indexById, jointName, partName } from "@/shared/linkage/names";
import { CAUTION_TEXT } from "@/shared/caution";
import { useEditorStore, useEditorStoreApi } from "../context";
import { toGraph } from "../store";
import { inputWord, inputWords, rodLinks, turningParts } from "./model";
import { ToScale } from "./ToScale";
import { NumField } from "./fields";
import MotionCharts from "./MotionCharts";
import { StopsPicture } from "./StopsPicture";

const PAGE = 25;

export default function GeometryPanel({ onClose }: { onClose: () => void }) {
  const api = useEditorStoreApi();
  const { nodes, joints, geo, settings, readOnly, report, system } = useEditorStore((s) => ({ nodes: s.nodes, joints: s.joints, geo: s.meta.geometry, settings: s.settings, readOnly: s.readOnly, report: s.report, system: s.meta.system }));
  const [error, setError] = useState<string | null>(null);
  const [page, setPage] = useState(0);
  const parts = useMemo(() => turningParts(nodes), [nodes]);
  const rods = useMemo(() => rodLinks({ nodes, joints }), [nodes, joints]);
  const motion = useMemo(() => (geo ? sweepGraph({ ...toGraph(api.getState()), nodes, joints, geometry: geo }, settings ?? DEFAULT_SETTINGS, 400) : null), [api, nodes, joints, geo, settings]);
  const sw = motion?.sweeps[0];
  const ends = motion?.ends[0];
  const [k, setK] = useState(0);
  const [playing, setPlaying] = useState(false);
  useEffect(() => { if (sw) setK((v) => Math.min(v || sw.neutral, sw.theta.length - 1)); }, [sw]);
  const dir = useRef(1);
  useEffect(() => {
    if (!playing || !sw || !ends) return;
    const t = setInterval(() => {
      setK((v) => {
        let n = v + dir.current * 4;
        if (n >= ends.ef) { n = ends.ef; dir.current = -1; }
        if (n <= ends.eb) { n = ends.eb; dir.current = 1; }
        return n;
      });
    }, 40);
    return () => clearInterval(t);
  }, [playing, sw, ends]);

  const set = (g: LinkageGeometry | undefined) => {
    if (!g) return api.getState().setGeometry(undefined);
    const r = geometrySchema.safeParse(g);
    if (!r.success) return setError(r.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; "));
    setError(null);
    api.getState().setGeometry(r.data);
  };
  const setPart = (id: string, f: (p: PartGeometry) => PartGeometry) => {
    if (!geo) return;
    const cur = geo.parts[id] ?? { pivot: { x: 0, y: 0 }, arms: {}, offsets: {} };
    set({ ...geo, parts: { ...geo.parts, [id]: f(cur) } });
  };

  if (!geo) {
    return (
      <section className="flex h-full flex-col gap-2 overflow-y-auto bg-paper p-3 text-[12px]" data-testid="geometry-panel" aria-label="Geometry">
        <Header onClose={onClose} />
        <p className="rounded border border-ink/10 bg-white p-2 text-ink-soft" data-testid="geometry-empty">
          Motion is not checked yet: this run has no geometry. Place each pivot in inches from a datum you choose (a station line, the firewall face) and give
          each arm&apos;s angle at neutral; the check then sweeps the run through the stick or pedal travel — gearing, transmission angle, over-centre, stops,
          rigging, and the loads where they are worst.
        </p>
        {!readOnly && (
          <div className="flex flex-wrap gap-2">
            <button type="button" className="rounded bg-ink px-2 py-1 text-white" data-testid="geometry-start"
              onClick={() => set(chainGeometry({ ...toGraph(api.getState()), nodes, joints }))}>
              Start from the arm lengths
            </button>
            <button type="button" className="rounded border border-ink/20 px-2 py-1" data-testid="geometry-start-empty" onClick={() => set(emptyGeometry())}>
              Start empty
            </button>
          </div>
        )}
        <p className="text-[10px] text-ink-soft">“Start from the arm lengths” lays one path out level, each arm square to its rod — a starting point to correct from the drawings.</p>
      </section>
    );
  }

  const rot: Record<string, number> = {};
  if (sw) {
    sw.chain.parts.forEach((p, i) => { rot[nodes[p]?.id ?? ""] = sw.rot[i][k] ?? 0; });
  }
  const nodeById = indexById(nodes);
  const summary = report?.motion?.chains[0];
  // Read from this sweep, so it follows the geometry as it is edited (the saved report says the same after a save).
  const sense = motion?.report.chains[0]?.sense ?? null;
  const words = inputWords(system, geo);
  const worstAt = summary ? summary.minTransmission.at : null;
  const pct = (t: number) => (sw ? ((t - sw.theta[0]) / (sw.theta[sw.theta.length - 1] - sw.theta[0] || 1)) * 100 : 0);
  const shown = parts.slice(page * PAGE, page * PAGE + PAGE);
  let lo = 180, hi = 0;
  if (sw && sw.ok[k]) for (let s = 0; s < sw.cosA.length; s++) { lo = Math.min(lo, mu(sw.cosA[s][k]), mu(sw.cosB[s][k])); hi = Math.max(hi, mu(sw.cosA[s][k]), mu(sw.cosB[s][k])); }

  return (
    <section className="flex h-full flex-col gap-2 overflow-y-auto bg-paper p-3 text-[12px] [&>*]:shrink-0" data-testid="geometry-panel" aria-label="Geometry" onKeyDown={ownKeys}>
      <Header onClose={onClose} />
      <div className="grid grid-cols-2 gap-2 sm:grid-cols-4">
        <label className="flex flex-col text-[10px] text-ink-soft">View
          <select value={geo.plane} disabled={readOnly} className="rounded border border-ink/15 bg-white px-1 py-0.5 text-[12px] text-ink" onChange={(e) => set({ ...geo, plane: e.target.value as "side" | "plan" })}>
            <option value="side">side</option><option value="plan">plan</option>
          </select>
        </label>
        <label className="col-span-1 flex flex-col text-[10px] text-ink-soft sm:col-span-3">Datum (what x and y are measured from)
          <input value={geo.datum} disabled={readOnly} maxLength={80} data-testid="geometry-datum" className="rounded border border-ink/15 bg-white px-1 py-0.5 text-[12px] text-ink" onChange={(e) => set({ ...geo, datum: e.target.value })} />
        </label>
        <label className="flex flex-col text-[10px] text-ink-soft">{system === "roll" ? "Stick right turns" : system === "yaw" ? "Pedal pushed turns" : "Forward turns"}
          <select value={geo.inputForward} disabled={readOnly} className="rounded border border-ink/15 bg-white px-1 py-0.5 text-[12px] text-ink" onChange={(e) => set({ ...geo, inputForward: e.target.value as "ccw" | "cw" })}>
            <option value="ccw">counter-clockwise</option><option value="cw">clockwise</option>
          </select>
        </label>
        <label className="flex flex-col text-[10px] text-ink-soft">{system === "yaw" ? "Trailing edge right turns" : "Surface up turns"}
          <select value={geo.surfaceUp} disabled={readOnly} className="rounded border border-ink/15 bg-white px-1 py-0.5 text-[12px] text-ink" onChange={(e) => set({ ...geo, surfaceUp: e.target.value as "ccw" | "cw" })}>
            <option value="ccw">counter-clockwise</option><option value="cw">clockwise</option>
          </select>
        </label>
        {system === "pitch" && (
          <label className="flex flex-col text-[10px] text-ink-soft">Pitch surface
            <select value={geo.pitchSurface ?? ""} disabled={readOnly} data-testid="geometry-pitch-surface" className="rounded border border-ink/15 bg-white px-1 py-0.5 text-[12px] text-ink"
              onChange={(e) => set({ ...geo, pitchSurface: e.target.value === "" ? undefined : (e.target.value as "tail" | "canard") })}>
              <option value="">not said (tail taken)</option><option value="tail">tail, behind the wing</option><option value="canard">canard, ahead of the wing</option>
            </select>
          </label>
        )}
        {system === "roll" && (
          <label className="flex flex-col text-[10px] text-ink-soft">Aileron on the
            <select value={geo.rollSide ?? ""} disabled={readOnly} data-testid="geometry-roll-side" className="rounded border border-ink/15 bg-white px-1 py-0.5 text-[12px] text-ink"
              onChange={(e) => set({ ...geo, rollSide: e.target.value === "" ? undefined : (e.target.value as "left" | "right") })}>
              <option value="">not said (sense not read)</option><option value="right">right wing</option><option value="left">left wing</option>
            </select>
          </label>
        )}
        {system === "yaw" && (
          <label className="flex flex-col text-[10px] text-ink-soft">Pushed pedal
            <select value={geo.yawPedal ?? ""} disabled={readOnly} data-testid="geometry-yaw-pedal" className="rounded border border-ink/15 bg-white px-1 py-0.5 text-[12px] text-ink"
              onChange={(e) => set({ ...geo, yawPedal: e.target.value === "" ? undefined : (e.target.value as "left" | "right") })}>
              <option value="">not said (sense not read)</option><option value="right">right pedal</option><option value="left">left pedal</option>
            </select>
          </label>
        )}
        <NumField label="Designer up" unit="°" optional value={geo.designTravel?.up} disabled={readOnly} testId="design-up"
          onChange={(v) => set({ ...geo, designTravel: v === undefined ? undefined : { down: 0, tolerance: 1, ...geo.designTravel, up: v } })} />
        <NumField label="Designer down" unit="°" optional value={geo.designTravel?.down} disabled={readOnly || !geo.designTravel} testId="design-down"
          onChange={(v) => geo.designTravel && set({ ...geo, designTravel: { ...geo.designTravel, down: v ?? 0 } })} />
      </div>
      {error && <p role="alert" className="text-[11px] text-hazard" data-testid="geometry-error">{error}</p>}

      <ToScale geo={geo} parts={parts} rods={rods} rot={rot} readOnly={readOnly}
        onMovePivot={(id, x, y) => setPart(id, (p) => ({ ...p, pivot: { x, y } }))} />

      {sw && ends ? (
        <div className="rounded border border-ink/10 bg-white p-2">
          <div className="flex items-center gap-2">
            <button type="button" className="w-14 rounded bg-ink px-2 py-0.5 text-[11px] text-white" data-testid="geometry-play" onClick={() => setPlaying((p) => !p)} aria-pressed={playing}>
              {playing ? "Pause" : "Play"}
            </button>
            <div className="relative flex-1">
              <input type="range" min={0} max={sw.theta.length - 1} value={k} className="w-full" data-testid="geometry-slider" aria-label="Input position"
                aria-valuetext={inputWord(sw.theta[k], words)} onChange={(e) => { setPlaying(false); setK(Number(e.target.value)); }} />
              {worstAt !== null && (
                <span className="pointer-events-none absolute -top-1 h-4 w-0.5 bg-hazard" style={{ left: `${pct(worstAt)}%` }} title="worst transmission angle" data-testid="worst-mark" />
              )}
            </div>
          </div>
          <p className="mt-1 text-[11px]" data-testid="geometry-readout">
            Input <b>{inputWord(sw.theta[k], words)}</b>
            {sw.ok[k] ? <> · surface <b>{sw.deflection[k].toFixed(1)}°</b> · gearing {sw.gearing[k].toFixed(2)} · transmission {lo.toFixed(0)}°–{hi.toFixed(0)}°</> : <> · <span className="text-hazard">the run cannot close here</span></>}
            {worstAt !== null && <> · worst angle at {inputWord(worstAt, words)} (red mark)</>}
          </p>
          {sense ? (
            <p className={`mt-1 text-[11px] ${senseReversed(sense) ? "font-medium text-hazard" : ""}`} data-testid="geometry-sense">
              <SenseLine sense={sense} wheel={nodes[sw.chain.input]?.kind === "controlWheel"} />
            </p>
          ) : null}
          <MotionCharts sw={sw} at={sw.theta[k]} stops={[sw.theta[ends.eb], sw.theta[ends.ef]]} words={words} />
          <StopsPicture geo={geo} parts={parts} rods={rods} nodes={nodes} sw={sw} words={words} steps={[ends.eb, sw.neutral, ends.ef]} title={api.getState().meta.name} />
        </div>
      ) : null}

      {report?.motion && report.motion.notChecked.length > 0 && (
        <ul className="list-disc rounded border border-caution/30 bg-caution/5 py-1 pl-5 pr-2 text-[11px]" data-testid="motion-not-checked">
          {report.motion.notChecked.map((m, i) => <li key={i}>{m}</li>)}
        </ul>
      )}

      {report?.motion && report.motion.worstLoads.length > 0 && (
        <table className="w-full text-[11px]" data-testid="worst-loads">
          <caption className="text-left text-[11px] font-medium">Each member&apos;s worst limit load over the travel</caption>
          <thead><tr className="text-left text-ink-soft"><th>member</th><th>load</th><th className="text-right">limit</th><th className="text-right">at</th></tr></thead>
          <tbody>
            {report.motion.worstLoads.map((w, i) => {
              const jt = w.subject.type === "joint" ? joints.find((j) => j.id === w.subject.id) : undefined;
              const name = w.subject.type === "node" ? partName(nodeById.get(w.subject.id)) : jt ? jointName(jt, nodeById) : w.subject.id;
              return (
                <tr key={i} className="border-t border-ink/5">
                  <td className="max-w-[12rem] truncate" title={name}>{name}</td><td>{w.what}</td>
                  <td className="text-right tabular-nums">{w.limit.toFixed(0)} {w.unit}</td>
                  <td className="text-right">{inputWord(w.at, words)}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      )}

      <div className="space-y-1" data-testid="geometry-parts">
        <h3 className="text-[11px] font-medium">Pivots (in) and arm angles at neutral (° counter-clockwise from +x)</h3>
        {shown.map((p) => {
          const pg = geo.parts[p.id];
          return (
            <fieldset key={p.id} className="grid grid-cols-4 gap-1 rounded border border-ink/10 bg-white p-1.5" data-testid={`geo-part-${p.id}`}>
              <legend className="px-1 text-[11px] font-medium">{p.name}</legend>
              <NumField label="x" unit="in" value={pg?.pivot.x} disabled={readOnly} testId={`geo-${p.id}-x`} onChange={(v) => setPart(p.id, (c) => ({ ...c, pivot: { ...c.pivot, x: v ?? 0 } }))} />
              <NumField label="y" unit="in" value={pg?.pivot.y} disabled={readOnly} testId={`geo-${p.id}-y`} onChange={(v) => setPart(p.id, (c) => ({ ...c, pivot: { ...c.pivot, y: v ?? 0 } }))} />
              {p.arms.map((a) => (
                <NumField key={a.port} label={`${a.port} arm`} unit="°" optional value={pg?.arms[a.port]} disabled={readOnly} testId={`geo-${p.id}-${a.port}`}
                  onChange={(v) => setPart(p.id, (c) => { const arms = { ...c.arms }; if (v === undefined) delete arms[a.port]; else arms[a.port] = v; return { ...c, arms }; })} />
              ))}
              {p.arms.filter((a) => a.port !== "grip").map((a) => (
                <NumField key={`o${a.port}`} label={`${a.port} out of plane`} unit="in" optional value={pg?.offsets[a.port]} disabled={readOnly} testId={`geo-${p.id}-${a.port}-z`}
                  onChange={(v) => setPart(p.id, (c) => { const offsets = { ...c.offsets }; if (v === undefined) delete offsets[a.port]; else offsets[a.port] = v; return { ...c, offsets }; })} />
              ))}
            </fieldset>
          );
        })}
        {parts.length > PAGE && (
          <div className="flex items-center gap-2 text-[11px]">
            <button type="button" disabled={page === 0} onClick={() => setPage(page - 1)} className="underline disabled:opacity-40">previous</button>
            <span>parts {page * PAGE + 1}–{Math.min(parts.length, (page + 1) * PAGE)} of {parts.length}</span>
            <button type="button" disabled={(page + 1) * PAGE >= parts.length} onClick={() => setPage(page + 1)} className="underline disabled:opacity-40">next</button>
          </div>
        )}
        {!parts.length && <p className="text-ink-soft">No part turns on a pivot yet: add a stick or pedal, cranks and a control horn in the diagram.</p>}
      </div>
      {!readOnly && (
        <button type="button" className="self-start text-[11px] text-hazard underline" onClick={() => set(undefined)} data-testid="geometry-remove">Remove the geometry</button>
      )}
      <p className="text-[10px] leading-3 text-ink-soft">{CAUTION_TEXT}</p>
    </section>
  );
}

/** Keys pressed in the geometry view are its own (arrows move a pivot, not the diagram's selection); Ctrl/⌘ keys still reach the editor. */
function ownKeys(e: React.KeyboardEvent) {
  if (!e.ctrlKey && !e.metaKey) e.stopPropagation();
}

function Header({ onClose }: { onClose: () => void }) {
  return (
    <div className="flex items-center justify-between">
      <h2 className="text-[13px] font-semibold">Geometry and motion</h2>
      <button type="button" className="text-[11px] underline" onClick={onClose} data-testid="geometry-close">Back to the diagram</button>
    </div>
  );
}

/** The control sense the sweep read, in its axis's words, and whether it is the right way round. */
function SenseLine({ sense, wheel }: { sense: SenseSummary; wheel: boolean }) {
  const ok = !senseReversed(sense);
  const still = " Still move the controls on the aircraft.";
  if (sense.axis === "roll") {
    const wing = `the ${sense.side} wing's aileron`;
    return <>Control sense: {wheel ? "wheel turned" : "stick"} right takes the trailing edge of {wing} <b>{sense.right}</b>{ok ? <> — the right way.{still}</> : <> — reversed for {wing}: see the findings.</>}</>;
  }
  if (sense.axis === "yaw") {
    return <>Control sense: the {sense.pedal} pedal pushed takes the rudder&apos;s trailing edge <b>{sense.pushed}</b>{ok ? <> — the right way.{still}</> : <> — reversed: see the findings.</>}</>;
  }
  const surface = sense.surface === "tail" ? "tail behind the wing" : "canard ahead of the wing";
  return <>Control sense: {wheel ? "wheel" : "stick"} forward takes the trailing edge <b>{sense.forward}</b>{ok ? <> — the right way for a {surface}{sense.surfaceRecorded ? "" : " (tail taken: the geometry does not say)"}.{still}</> : <> — reversed for a {surface}: see the findings.</>}</>;
}
