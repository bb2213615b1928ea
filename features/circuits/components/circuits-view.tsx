"use client";
import { useEffect, useState } from "react";
import { CartesianGrid, ComposedChart, LabelList, Line, Scatter, XAxis, YAxis } from "recharts";
import type { CircuitResult, PlantWarning } from "@/lib/engine/plant/circuit";
import type { SafetyCaution } from "@/lib/engine/plant/safety";
import { convert, fmt, UNIT_LABELS, type UnitSystem } from "@/lib/units";
import { logTicks, type CircuitChart } from "../chart-data";

export interface CircuitCardData {
  circuit: CircuitResult;
  chart: CircuitChart | null;
  warnings: PlantWarning[];
  caution: SafetyCaution | undefined;
}

export function CircuitsView({ cards, s, codesNotice, meta }: { cards: CircuitCardData[]; s: UnitSystem; codesNotice: string; meta: { version: number; inputHash: string; engineVersion: string } }) {
  return (
    <main className="flex flex-col gap-4 p-4">
      <p className="text-xs text-muted">
        Server calculation of version {meta.version} · engine {meta.engineVersion} · input hash <span className="font-mono">{meta.inputHash}</span> · enthalpies on the IIR reference state (h = 200 kJ/kg, s = 1 kJ/(kg·K) for saturated liquid at 0 °C)
      </p>
      {cards.map((c) => (
        <CircuitCard key={c.circuit.id} card={c} s={s} />
      ))}
      <p className="text-xs text-muted">{codesNotice}</p>
    </main>
  );
}

function Row({ label, value, title }: { label: string; value: string; title?: string }) {
  return (
    <div className="contents" title={title}>
      <dt className="text-muted">{label}</dt>
      <dd className="text-right font-mono">{value}</dd>
    </div>
  );
}

function CircuitCard({ card, s }: { card: CircuitCardData; s: UnitSystem }) {
  const c = card.circuit;
  const kg = (v: number) => `${fmt.number(convert.massToDisplay(v, s), 3)} ${UNIT_LABELS[s].mass}/s`;
  const temp = c.cycle === "transcritical" ? "Gas-cooler outlet" : "Condensing";
  // Far past any compressor's limit: shown above everything else on the card, not in the list.
  const extreme = card.warnings.filter((w) => w.code === "DISCHARGE_TEMP_EXTREME");
  const others = card.warnings.filter((w) => w.code !== "DISCHARGE_TEMP_EXTREME");
  const cascadeSgen = c.entropyGeneration.byComponentW_K.cascadeExchanger;
  return (
    <article className="rounded border border-line bg-surface p-3" aria-labelledby={`c-${c.id}`}>
      <header className="mb-2 flex flex-wrap items-baseline gap-3">
        <h3 id={`c-${c.id}`} className="text-base font-semibold">
          {c.tag}
        </h3>
        <span className="text-sm">
          {c.refrigerant} {card.caution ? <span className="rounded bg-surface-3 px-1 text-xs">safety group {card.caution.safetyGroup}</span> : null}
        </span>
        <span className="text-xs text-muted">
          {c.arrangement} · {c.compressor.type} × {c.compressor.units}
          {c.compressor.standbyUnits ? ` (${c.compressor.standbyUnits} standby)` : ""} · blends: {c.tempConvention} point
        </span>
      </header>
      {extreme.map((w) => (
        <div key={w.message} role="alert" data-testid="discharge-extreme" className="mb-3 rounded border-2 border-danger bg-danger/10 p-2 text-sm text-danger">
          <p className="font-semibold">⚠ Discharge temperature beyond any compressor and oil</p>
          <p className="mt-0.5">{w.message}</p>
        </div>
      ))}
      <div className="grid gap-4 lg:grid-cols-[minmax(18rem,24rem)_1fr]">
        <div className="flex flex-col gap-3 text-sm">
          <dl className="grid grid-cols-[auto_auto] gap-x-4 gap-y-0.5">
            <Row label="COP" value={fmt.cop(c.cop)} title="Refrigeration ÷ (shaft + pump input)" />
            <Row label="Carnot COP" value={c.copCarnot === null ? "—" : fmt.cop(c.copCarnot)} title="T_L ÷ (T_H − T_L), entropy-mean cold reservoir and the sink, in kelvin" />
            <Row label="Second-law efficiency" value={c.secondLawEfficiency === null ? "—" : fmt.percent(c.secondLawEfficiency)} title="COP ÷ Carnot COP" />
            <Row label="Suction (saturated)" value={fmt.temp(c.suctionC, s)} />
            <Row label={temp} value={fmt.temp(c.condensingC, s)} />
            {c.r744 ? (
              <>
                <Row
                  label="R744 mode at design"
                  value={c.r744.mode === "transcritical" ? "transcritical (gas cooler)" : "subcritical (condensing, receiver)"}
                  title="Subcritical when the gas-cooler outlet is at or below the switch-over temperature"
                />
                <Row
                  label="Switch-over to condensing"
                  value={`${c.sinkKind === "dry-bulb" ? "ambient" : "sink"} ≤ ${fmt.temp(c.r744.switchOverSinkC, s)}`}
                  title={`Gas-cooler outlet at or below ${fmt.temp(c.r744.switchOverC, s)} (the circuit's switch-over; default critical temperature − 5 K)`}
                />
                {c.gasCoolerPa !== undefined ? (
                  <Row
                    label={c.r744.highSide === "set" ? "High side (set point)" : "High side (optimised)"}
                    value={fmt.pressure(c.gasCoolerPa, s)}
                    title={
                      c.r744.highSide === "set"
                        ? "Set point of the high-pressure control, from the circuit's input"
                        : `Best COP, searched from ${fmt.pressure(c.r744.searchFromPa ?? 0, s)} to ${fmt.pressure(c.r744.searchToPa ?? 0, s)}`
                    }
                  />
                ) : null}
              </>
            ) : null}
            {c.intermediateC !== undefined ? <Row label="Intermediate" value={fmt.temp(c.intermediateC, s)} /> : null}
            <Row label="Refrigeration" value={fmt.power(c.refrigerationW, s, "refrigeration")} title="Refrigeration duty (not electrical)" />
            {c.hotGasDefrost && c.hotGasDefrost.heatW > 0 ? (
              <Row
                label="Hot-gas defrost carried"
                value={fmt.power(c.hotGasDefrost.heatW, s, "refrigeration")}
                title={`24-h mean heat of the hot gas these compressors supply for ${c.hotGasDefrost.byEvaporator.map((e) => `${e.tag} (${e.roomId})`).join(", ")}: ${c.hotGasDefrost.formula}`}
              />
            ) : null}
            <Row label="Compressor shaft" value={fmt.power(c.shaftPowerW, s, "electrical").replace("kW(e)", "kW shaft")} title="Mechanical power at the compressor shaft" />
            <Row label="Electrical input" value={fmt.power(c.electricalW, s, "electrical")} title="Compressor motors + pumps + condenser fans" />
            <Row label="Heat rejected" value={fmt.power(c.heatRejectedW, s, "heat")} />
            <Row label="Mass flow" value={kg(c.massFlowKgS)} />
            <Row label="Discharge temperature" value={fmt.temp(c.dischargeTempC, s)} />
            <Row label="Pressure ratio" value={fmt.number(c.pressureRatio, 2)} />
            <Row label="Entropy generated" value={`${fmt.number(c.entropyGeneration.totalW_K, 1)} W/K`} title="Σ over components; ≥ 0 by the second law" />
            {cascadeSgen !== undefined ? (
              <Row label="of which cascade exchanger" value={`${fmt.number(cascadeSgen, 1)} W/K`} title="Against the low stage's desuperheating and condensing stream at its mean temperature Δh/Δs" />
            ) : null}
            {c.sinkKind === "cascade" ? (
              <Row label="Rejects through its stream at" value={fmt.temp(c.entropySinkC, s)} title="Mean temperature Δh/Δs of the desuperheating and condensing stream in the cascade exchanger" />
            ) : null}
          </dl>
          {others.length ? (
            <ul className="flex flex-col gap-1 text-xs">
              {others.map((w, i) => (
                <li key={i} className={w.severity === "warning" ? "text-warn" : "text-muted"}>
                  {w.severity === "warning" ? "⚠ Warning:" : "ℹ Note:"} {w.message}
                </li>
              ))}
            </ul>
          ) : extreme.length ? null : (
            <p className="text-xs text-ok">✓ No warnings for this circuit.</p>
          )}
          {card.caution ? (
            <div className="rounded border border-warn/50 bg-warn/5 p-2 text-xs">
              <p className="font-semibold">⚠ Safety — {card.caution.refrigerant} ({card.caution.safetyGroup})</p>
              <ul className="mt-1 list-disc pl-4">
                {card.caution.cautions.map((m) => (
                  <li key={m}>{m}</li>
                ))}
              </ul>
            </div>
          ) : null}
        </div>
        {card.chart ? <PhChartView chart={card.chart} s={s} tag={c.tag} /> : <p className="text-sm text-muted">No chart: the fluid could not be drawn in this range.</p>}
      </div>
    </article>
  );
}

function PhChartView({ chart, s, tag }: { chart: CircuitChart; s: UnitSystem; tag: string }) {
  const p = (pa: number) => convert.pressureToDisplay(pa, s, "abs");
  const pUnit = UNIT_LABELS[s].pressure_abs;
  const [hover, setHover] = useState<CircuitChart["cycle"][number] | null>(null);
  const [ready, setReady] = useState(false);
  useEffect(() => {
    const t = setTimeout(() => setReady(true), 0);
    return () => clearTimeout(t);
  }, []);
  const pt = (q: { h: number; p: number }) => ({ h: q.h / 1000, p: p(q.p) });
  const cycle = chart.cycle.map((q) => ({ ...pt(q), id: q.id }));
  const loop = [...cycle, cycle[0]];
  const domain = [p(chart.pMinPa), p(chart.pMaxPa)];
  const hs = [...chart.dome.points, ...chart.cycle].map((q) => q.h / 1000);
  const hDomain = [Math.floor(Math.min(...hs) / 100) * 100, Math.ceil(Math.max(...hs) / 100) * 100];
  return (
    <figure className="flex flex-col gap-2">
      <div className="min-h-[22rem] w-full" role="img" aria-label={`Pressure–enthalpy chart of ${tag} (${chart.fluidId}): saturation dome and the cycle's state points 1 to ${cycle.length}; the table below lists them.`}>
        {ready ? (
          <ComposedChart responsive style={{ width: "100%", height: 352 }} margin={{ top: 8, right: 16, bottom: 20, left: 8 }}>
            <CartesianGrid strokeDasharray="3 3" stroke="var(--line)" />
            <XAxis type="number" dataKey="h" domain={hDomain} allowDataOverflow tick={{ fontSize: 11, fill: "var(--muted)" }} label={{ value: "h (kJ/kg)", position: "insideBottom", offset: -10, fill: "var(--muted)", fontSize: 11 }} />
            <YAxis
              type="number"
              dataKey="p"
              scale="log"
              domain={domain}
              allowDataOverflow
              ticks={logTicks(domain[0], domain[1])}
              tickFormatter={(v: number) => fmt.number(v, v < 1 ? 2 : v < 10 ? 1 : 0)}
              tick={{ fontSize: 11, fill: "var(--muted)" }}
              label={{ value: `p (${pUnit}, log)`, angle: -90, position: "insideLeft", fill: "var(--muted)", fontSize: 11 }}
            />
            {chart.isotherms.map((i) => (
              <Line key={i.label} data={i.points.map(pt)} dataKey="p" type="linear" dot={false} stroke="var(--line)" strokeWidth={1} isAnimationActive={false} legendType="none" name={i.label} />
            ))}
            <Line data={chart.dome.points.map(pt)} dataKey="p" type="monotone" dot={false} stroke="var(--muted)" strokeWidth={1.5} isAnimationActive={false} name="saturation dome" />
            <Line data={loop} dataKey="p" type="linear" dot={false} stroke="var(--accent)" strokeWidth={2} isAnimationActive={false} name="cycle" />
            <Scatter
              data={cycle}
              dataKey="p"
              fill="var(--accent)"
              isAnimationActive={false}
              onMouseEnter={(d: unknown) => {
                const id = (d as { payload?: { id?: string } })?.payload?.id;
                setHover(chart.cycle.find((q) => q.id === id) ?? null);
              }}
              onMouseLeave={() => setHover(null)}
            >
              <LabelList dataKey="id" position="top" fill="var(--ink)" fontSize={12} />
            </Scatter>
          </ComposedChart>
        ) : null}
      </div>
      <p className="min-h-5 text-xs" aria-live="polite">
        {hover ? (
          <>
            <span className="font-semibold">
              {hover.id} · {hover.label}
            </span>
            : p {fmt.pressure(hover.p, s)} · T {fmt.temp(hover.tK - 273.15, s)} · h {fmt.number(hover.h / 1000, 1)} kJ/kg · s {fmt.number(hover.s / 1000, 3)} kJ/(kg·K)
          </>
        ) : (
          <span className="text-muted">Hover a numbered point for its state.</span>
        )}
      </p>
      <table className="text-xs">
        <caption className="text-left text-muted">State points</caption>
        <thead className="text-muted">
          <tr>
            <th className="text-left font-normal">#</th>
            <th className="text-left font-normal">State</th>
            <th className="text-right font-normal">p</th>
            <th className="text-right font-normal">T</th>
            <th className="text-right font-normal">h (kJ/kg)</th>
            <th className="text-right font-normal">s (kJ/(kg·K))</th>
          </tr>
        </thead>
        <tbody className="font-mono">
          {chart.cycle.map((q) => (
            <tr key={q.id}>
              <td>{q.id}</td>
              <td className="font-sans">{q.label}</td>
              <td className="text-right">{fmt.pressure(q.p, s)}</td>
              <td className="text-right">{fmt.temp(q.tK - 273.15, s)}</td>
              <td className="text-right">{fmt.number(q.h / 1000, 1)}</td>
              <td className="text-right">{fmt.number(q.s / 1000, 3)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </figure>
  );
}
