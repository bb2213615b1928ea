import type { ReactNode } from "react";
import { fmt, UNIT_LABELS, convert, type UnitSystem } from "@/lib/units";
import { SAFETY_GROUP } from "@/lib/engine/plant/safety";
import { methodsAndSources, revisionLabel, scheduleKindWord } from "@/features/schedule";
import type { ReportData } from "../queries";
import { OptionsReportTable } from "@/features/options/components/options-report";

const th = "border-b border-line py-1 pr-3 text-left text-xs font-medium text-muted";
const td = "border-b border-line py-1 pr-3 align-top";
const tdn = `${td} text-right font-mono tabular-nums whitespace-nowrap`;

function Section({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="report-section mt-6">
      <h2 id={id} className="mb-2 border-b border-ink/30 pb-1 text-base font-semibold">
        {title}
      </h2>
      {children}
    </section>
  );
}

/** The printable calculation report of one version: every number the design rests on, with its method and source. */
export function CalculationReport({ d, unitSystem: s, generatedAt, generatedBy }: { d: ReportData; unitSystem: UnitSystem; generatedAt: Date; generatedBy: string }) {
  const r = d.result;
  const L = UNIT_LABELS[s];
  const roomNames = Object.fromEntries(d.model.rooms.map((x) => [x.id, x.name]));
  const circuitTags = Object.fromEntries(r.plant.circuits.map((c) => [c.id, c.tag]));
  const pw = (w: number) => fmt.power(w, s);
  return (
    <article id="calc-report" className="mx-auto max-w-5xl bg-surface p-6 text-sm text-ink">
      <header className="border-b-2 border-ink pb-3">
        <p className="text-xs uppercase tracking-wide text-muted">Calculation report</p>
        <h1 className="text-xl font-semibold">{d.facilityName}</h1>
        <dl className="mt-2 grid grid-cols-2 gap-x-6 gap-y-0.5 text-xs sm:grid-cols-4">
          <dt className="text-muted">Revision</dt>
          <dd className="font-medium">{d.revision.issued && d.revision.letter ? `${d.revision.letter} — ${d.revision.status}` : "not issued"}</dd>
          <dt className="text-muted">Model version</dt>
          <dd className="font-mono">{d.revision.number}{d.revision.number !== d.currentVersion ? ` (current: ${d.currentVersion})` : ""}</dd>
          <dt className="text-muted">Checked by</dt>
          <dd>{d.revision.checkedBy ?? "—"}</dd>
          <dt className="text-muted">Issued</dt>
          <dd>{d.issuedAt ? d.issuedAt.toISOString().slice(0, 10) : "—"}</dd>
          <dt className="text-muted">Generated</dt>
          <dd>
            {generatedAt.toISOString().replace("T", " ").slice(0, 16)} UTC by {generatedBy}
          </dd>
          <dt className="text-muted">Engine · input hash</dt>
          <dd className="font-mono">
            {d.engineVersion} · {d.inputHash}
          </dd>
        </dl>
        {!d.revision.issued ? <p className="mt-2 text-xs font-semibold">{revisionLabel(d.revision)}: for information, not an issued design.</p> : null}
      </header>

      <Section id="basis-h" title="1. Design basis">
        <table className="w-full">
          <tbody>
            <tr>
              <td className={td}>Design dry bulb</td>
              <td className={tdn}>{fmt.temp(d.site.designDryBulbC, s)}</td>
            </tr>
            {d.site.coincidentWetBulbC != null ? (
              <tr>
                <td className={td}>Coincident wet bulb</td>
                <td className={tdn}>{fmt.temp(d.site.coincidentWetBulbC, s)}</td>
              </tr>
            ) : null}
            {d.site.designRhPct != null ? (
              <tr>
                <td className={td}>Design relative humidity</td>
                <td className={tdn}>{fmt.percent(d.site.designRhPct / 100)}</td>
              </tr>
            ) : null}
            <tr>
              <td className={td}>Ground temperature</td>
              <td className={tdn}>{fmt.temp(d.site.groundTempC, s)}</td>
            </tr>
            <tr>
              <td className={td}>Elevation · site air pressure</td>
              <td className={tdn}>
                {fmt.length(d.site.elevationM, s)} · {fmt.pressure(r.ledger.site.pressurePa, s)}
              </td>
            </tr>
          </tbody>
        </table>
        <ul className="mt-2 list-disc pl-5 text-xs">
          {r.ledger.options.statements.map((x) => (
            <li key={x}>{x}</li>
          ))}
        </ul>
      </Section>

      <Section id="rooms-h" title="2. Room heat ledgers">
        {r.ledger.rooms.map((room) => {
          const m = d.model.rooms.find((x) => x.id === room.roomId);
          return (
            <div key={room.roomId} className="report-block mb-5">
              <h3 className="text-sm font-semibold">
                {room.roomName} <span className="font-normal text-muted">· set point {m ? fmt.temp(m.setPointC, s) : "—"} · {m ? fmt.percent(m.rhPct / 100) : ""} RH</span>
              </h3>
              <table className="mt-1 w-full">
                <thead>
                  <tr>
                    <th className={th}>Line</th>
                    <th className={`${th} text-right`}>Load ({L.power_refrigeration})</th>
                    <th className={`${th} text-right`}>Energy ({L.energy}/day)</th>
                    <th className={th}>Method · source</th>
                  </tr>
                </thead>
                <tbody>
                  {room.components.map((c, i) => (
                    <tr key={i}>
                      <td className={td}>{c.label}</td>
                      <td className={tdn}>{pw(c.powerW)}</td>
                      <td className={tdn}>{fmt.number(convert.energyToDisplay(c.energyKWhPerDay, s), 1)}</td>
                      <td className={`${td} text-xs text-muted`}>
                        {c.trace.method} · {c.trace.source}
                      </td>
                    </tr>
                  ))}
                  <tr className="font-semibold">
                    <td className={td}>24-h average</td>
                    <td className={tdn}>{pw(room.averageLoadW)}</td>
                    <td className={tdn}>{fmt.number(convert.energyToDisplay(room.totalEnergyKWhPerDay, s), 1)}</td>
                    <td className={td} />
                  </tr>
                  <tr>
                    <td className={td}>
                      Required: 24-h energy × (1 + {fmt.percent(room.safetyFactor)}) / {fmt.number(room.runHoursPerDay, 0)} h
                    </td>
                    <td className={tdn}>{pw(room.requiredCapacityW)}</td>
                    <td className={td} colSpan={2} />
                  </tr>
                  <tr>
                    <td className={td}>
                      Required: peak hour {String(room.peakHour).padStart(2, "0")}:00 × (1 + {fmt.percent(room.safetyFactor)})
                    </td>
                    <td className={tdn}>{pw(room.requiredPeakCapacityW)}</td>
                    <td className={td} colSpan={2} />
                  </tr>
                  <tr className="font-semibold">
                    <td className={td}>Design capacity (the larger)</td>
                    <td className={tdn}>{pw(room.designCapacityW)}</td>
                    <td className={td} colSpan={2} />
                  </tr>
                </tbody>
              </table>
            </div>
          );
        })}
      </Section>

      <Section id="circuits-h" title="3. Circuits">
        {r.plant.circuits.map((c) => (
          <div key={c.id} className="report-block mb-5">
            <h3 className="text-sm font-semibold">
              {c.tag} · {c.refrigerant} ({SAFETY_GROUP[c.refrigerant]}) · {c.arrangement}, {c.tempConvention} convention
            </h3>
            <div className="mt-1 grid grid-cols-1 items-start gap-4 md:grid-cols-2 print:grid-cols-2">
              <table className="w-full">
                <tbody>
                  {[
                    ["Suction", fmt.temp(c.suctionC, s)],
                    [c.cycle === "transcritical" ? "Gas-cooler outlet" : "Condensing", fmt.temp(c.condensingC, s)],
                    ...(c.intermediateC !== undefined ? [["Intermediate", fmt.temp(c.intermediateC, s)]] : []),
                    ["Superheat · subcooling", `${fmt.tempDiff(c.superheatK, s)} · ${fmt.tempDiff(c.subcoolingK, s)}`],
                    ["Refrigeration", pw(c.refrigerationW)],
                    ["Mass flow", `${fmt.number(convert.massToDisplay(c.massFlowKgS, s), 3)} ${L.mass}/s`],
                    ["Compressor shaft power", fmt.power(c.shaftPowerW, s, "electrical").replace("kW(e)", "kW (shaft)")],
                    ["Electrical input (compressors, pumps, condenser fans)", fmt.power(c.electricalW, s, "electrical")],
                    ["COP", fmt.cop(c.cop)],
                    ["Carnot COP", c.copCarnot === null ? "—" : fmt.cop(c.copCarnot)],
                    ["Second-law efficiency", c.secondLawEfficiency === null ? "—" : fmt.percent(c.secondLawEfficiency)],
                    ["Heat rejected", fmt.power(c.heatRejectedW, s, "heat")],
                    ["Discharge temperature", fmt.temp(c.dischargeTempC, s)],
                    ["Pressure ratio", fmt.number(c.pressureRatio, 2)],
                    ["Entropy generated", `${fmt.number(c.entropyGeneration.totalW_K, 2)} W/K`],
                    ["Energy balance closure", fmt.percent(c.energyBalance.relativeError)],
                  ].map(([k, v]) => (
                    <tr key={k}>
                      <td className={td}>{k}</td>
                      <td className={tdn}>{v}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
              <table className="w-full">
                <thead>
                  <tr>
                    <th className={th}>Point</th>
                    <th className={`${th} text-right`}>p ({L.pressure_abs})</th>
                    <th className={`${th} text-right`}>T ({L.temp})</th>
                    <th className={`${th} text-right`}>h (kJ/kg)</th>
                    <th className={`${th} text-right`}>s (kJ/kg·K)</th>
                  </tr>
                </thead>
                <tbody>
                  {c.statePoints.map((p) => (
                    <tr key={p.id}>
                      <td className={td} title={p.label}>
                        {p.id} <span className="text-xs text-muted">{p.label}</span>
                      </td>
                      <td className={tdn}>{fmt.number(convert.pressureToDisplay(p.pPa, s), 2)}</td>
                      <td className={tdn}>{fmt.number(convert.tempToDisplay(p.tK - 273.15, s), 1)}</td>
                      <td className={tdn}>{fmt.number(p.hJkg / 1000, 1)}</td>
                      <td className={tdn}>{fmt.number(p.sJkgK / 1000, 4)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
            <p className="mt-1 text-xs text-muted">Enthalpy and entropy on the IIR reference state (h = 200 kJ/kg, s = 1 kJ/kg·K for saturated liquid at 0 °C).</p>
          </div>
        ))}
      </Section>

      <Section id="schedule-h" title="4. Equipment schedule">
        <table className="w-full">
          <thead>
            <tr>
              <th className={th}>Tag</th>
              <th className={th}>Item</th>
              <th className={th}>Room / circuit</th>
              <th className={`${th} text-right`}>Qty (standby)</th>
              <th className={`${th} text-right`}>Duty / unit</th>
              <th className={`${th} text-right`}>Electrical</th>
              <th className={th}>Rating conditions</th>
            </tr>
          </thead>
          <tbody>
            {d.schedule.map((x) => (
              <tr key={x.tag}>
                <td className={`${td} font-mono font-semibold`}>{x.tag}</td>
                <td className={td}>
                  {scheduleKindWord(x.kind)}
                  <div className="text-xs text-muted">{x.description}</div>
                </td>
                <td className={td}>{[x.roomId ? roomNames[x.roomId] : null, x.circuitId ? circuitTags[x.circuitId] : null].filter(Boolean).join(" · ") || "—"}</td>
                <td className={tdn}>
                  {x.quantity}
                  {x.standbyQuantity ? ` (${x.standbyQuantity})` : ""}
                </td>
                <td className={tdn}>{fmt.power(x.dutyPerUnitW, s, x.kind === "condenser" || x.kind === "cascade-hx" ? "heat" : "refrigeration")}</td>
                <td className={tdn}>{fmt.power(x.electricalW, s, "electrical")}</td>
                <td className={`${td} text-xs`}>{x.ratingConditions}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </Section>

      <Section id="methods-h" title="5. Methods and sources">
        <table className="w-full">
          <tbody>
            {methodsAndSources(r).map((m) => (
              <tr key={m.method + m.source}>
                <td className={td}>{m.method}</td>
                <td className={`${td} text-xs text-muted`}>{m.source}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </Section>

      <Section id="cautions-h" title="6. Refrigerant safety and codes">
        <ul className="list-disc pl-5">
          {r.plant.cautions.flatMap((c) =>
            c.cautions.map((t) => (
              <li key={c.refrigerant + t}>
                <span className="font-semibold">
                  {c.refrigerant} ({c.safetyGroup}):
                </span>{" "}
                {t}
              </li>
            )),
          )}
        </ul>
        <p className="mt-2 font-semibold">{r.plant.codesNotice}</p>
        {r.plant.warnings.length ? (
          <>
            <h3 className="mt-3 text-sm font-semibold">Warnings</h3>
            <ul className="list-disc pl-5 text-xs">
              {r.plant.warnings.map((w) => (
                <li key={w.code + w.ref.id + w.message} className={w.code === "DISCHARGE_TEMP_EXTREME" ? "font-semibold text-danger" : undefined}>
                  ⚠ {w.ref.tag ?? w.ref.id}: {w.message}
                </li>
              ))}
            </ul>
          </>
        ) : null}
      </Section>

      {d.options ? (
        <Section id="options-h" title="7. Plant options compared">
          <OptionsReportTable c={d.options.comparison} unitSystem={s} currency={d.options.currency} weatherLabel={d.options.weather?.label ?? null} codesNotice={r.plant.codesNotice} />
        </Section>
      ) : null}
    </article>
  );
}
