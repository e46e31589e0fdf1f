"use client";
/**
 * Charts of one swept run against the input's deflection: the surface's deflection and the gearing, and the
 * transmission angle (lowest and highest over every rod end) with its 40°–140° band; the stops and the
 * shown step are marked. At most ~240 points are drawn, evenly picked from the sweep (said under the chart).
 */
import { CartesianGrid, Line, LineChart, ReferenceArea, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { mu, type ChainSweep } from "@/shared/analysis/motion";
import { TRANSMISSION_MAX, TRANSMISSION_MIN } from "@/shared/analysis";
import { PITCH_WORDS, type InputWords } from "./model";

const MAX_POINTS = 240;

export function chartRows(sw: ChainSweep) {
  const n = sw.theta.length;
  const every = Math.max(1, Math.ceil(n / MAX_POINTS));
  const rows: { input: number; deflection: number | null; gearing: number | null; muMin: number | null; muMax: number | null }[] = [];
  for (let k = 0; k < n; k += every) {
    if (!sw.ok[k]) { rows.push({ input: sw.theta[k], deflection: null, gearing: null, muMin: null, muMax: null }); continue; }
    let lo = 180, hi = 0;
    for (let s = 0; s < sw.cosA.length; s++) {
      const a = mu(sw.cosA[s][k]), b = mu(sw.cosB[s][k]);
      lo = Math.min(lo, a, b); hi = Math.max(hi, a, b);
    }
    rows.push({ input: +sw.theta[k].toFixed(2), deflection: +sw.deflection[k].toFixed(2), gearing: +sw.gearing[k].toFixed(3), muMin: +lo.toFixed(1), muMax: +hi.toFixed(1) });
  }
  return { rows, every };
}

export default function MotionCharts({ sw, at, stops, words = PITCH_WORDS }: { sw: ChainSweep; at: number; stops: [number, number]; words?: InputWords }) {
  const { rows, every } = chartRows(sw);
  const marks = (
    <>
      <ReferenceLine x={stops[0]} stroke="#b45309" strokeDasharray="3 3" label={{ value: "stop", fontSize: 9, position: "insideTopLeft" }} />
      <ReferenceLine x={stops[1]} stroke="#b45309" strokeDasharray="3 3" label={{ value: "stop", fontSize: 9, position: "insideTopRight" }} />
      <ReferenceLine x={+at.toFixed(2)} stroke="#0f172a" />
    </>
  );
  const x = <XAxis dataKey="input" type="number" domain={["dataMin", "dataMax"]} tick={{ fontSize: 9 }} unit="°" />;
  return (
    <div className="space-y-2" data-testid="motion-charts">
      <figure>
        <figcaption className="text-[11px] font-medium">Surface deflection (° up) and gearing (surface ° per input °) against input (° {words[0]})</figcaption>
        <div className="h-36 w-full">
          <ResponsiveContainer width="100%" height="100%">
            <LineChart data={rows} margin={{ top: 6, right: 4, bottom: 0, left: -18 }}>
              <CartesianGrid stroke="#eef2f6" />
              {x}
              <YAxis yAxisId="d" tick={{ fontSize: 9 }} />
              <YAxis yAxisId="g" orientation="right" tick={{ fontSize: 9 }} width={32} />
              <Tooltip contentStyle={{ fontSize: 11 }} />
              {marks}
              <Line yAxisId="d" dataKey="deflection" name="deflection °" stroke="#0f766e" dot={false} isAnimationActive={false} connectNulls={false} />
              <Line yAxisId="g" dataKey="gearing" name="gearing" stroke="#7c3aed" dot={false} strokeDasharray="4 2" isAnimationActive={false} />
            </LineChart>
          </ResponsiveContainer>
        </div>
      </figure>
      <figure>
        <figcaption className="text-[11px] font-medium">Transmission angle, lowest and highest rod end (°); keep inside 40°–140°</figcaption>
        <div className="h-32 w-full" data-testid="transmission-chart">
          <ResponsiveContainer width="100%" height="100%">
            <LineChart data={rows} margin={{ top: 6, right: 4, bottom: 0, left: -18 }}>
              <CartesianGrid stroke="#eef2f6" />
              {x}
              <YAxis domain={[0, 180]} ticks={[0, 40, 90, 140, 180]} tick={{ fontSize: 9 }} />
              <ReferenceArea y1={TRANSMISSION_MIN} y2={TRANSMISSION_MAX} fill="#16a34a" fillOpacity={0.08} />
              <ReferenceLine y={TRANSMISSION_MIN} stroke="#16a34a" strokeDasharray="2 2" />
              <ReferenceLine y={TRANSMISSION_MAX} stroke="#16a34a" strokeDasharray="2 2" />
              <Tooltip contentStyle={{ fontSize: 11 }} />
              {marks}
              <Line dataKey="muMin" name="lowest °" stroke="#dc2626" dot={false} isAnimationActive={false} />
              <Line dataKey="muMax" name="highest °" stroke="#2563eb" dot={false} isAnimationActive={false} />
            </LineChart>
          </ResponsiveContainer>
        </div>
      </figure>
      <p className="text-[10px] text-ink-soft">{sw.theta.length} steps swept{every > 1 ? `; every ${every}th drawn` : ""}.</p>
    </div>
  );
}
