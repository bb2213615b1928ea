"use client";
import { useEffect, useMemo, useRef, useState } from "react";
import { useForm, type FieldErrors, type Resolver } from "react-hook-form";
import { Button } from "@/components/ui/button";
import type { UnitSystem } from "@/lib/units";
import { circuits, condensers, entityOf, evaporators, OUTDOORS, parseNodeId } from "../graph";
import { splitField, type Problem } from "../evaluate";
import { ENTITY_SCHEMAS, FIELDS, FormFieldError, fromForm, isLinkIssue, issueKey, toForm, unitLabel, type FieldDef, type FormValues } from "../inspector-fields";
import type { CanvasDoc, NodeKind } from "../schema";

type EditKind = Exclude<NodeKind, "outdoors">;

const OPTION_WORDS: Record<string, string> = {
  stripCurtain: "strip curtain",
  airCurtain: "air curtain",
  fastDoor: "fast door",
  dx: "direct expansion (DX)",
  pumped: "pumped recirculation",
  ca: "controlled atmosphere",
};

/** The directions a wall can face and the surface colours the solar allowance knows (lib/engine/loads/transmission.ts). */
const FACINGS = ["N", "NE", "E", "SE", "S", "SW", "W", "NW"] as const;
const COLOURS = ["light", "medium", "dark"] as const;
type SurfaceLike = { kind: string; orientation?: string; colour?: string; otherSide?: unknown; label?: string; id?: string };

export function Inspector(props: {
  nid: string;
  doc: CanvasDoc;
  unitSystem: UnitSystem;
  canEdit: boolean;
  problems: Problem[];
  onChange: (entity: object, key: string) => void;
  onDelete: () => void;
}) {
  const { kind } = parseNodeId(props.nid);
  if (kind === "outdoors")
    return (
      <section aria-label="Inspector" className="p-3 text-sm">
        <h3 className="font-semibold">Outdoors</h3>
        <p className="mt-1 text-xs text-muted">The site&apos;s design air, from Site &amp; settings. Connect doors that open to the outside here.</p>
      </section>
    );
  return <EntityForm {...props} kind={kind} />;
}

function EntityForm({ nid, doc, unitSystem: s, canEdit, problems, onChange, onDelete, kind }: Parameters<typeof Inspector>[0] & { kind: EditKind }) {
  const entity = entityOf(doc, nid) as Record<string, unknown> | undefined;
  const entityRef = useRef(entity);
  entityRef.current = entity;
  const committed = useRef<object | undefined>(entity);
  const initial = useRef<FormValues>(entity ? toForm(entity, kind, s) : {});
  const schema = ENTITY_SCHEMAS[kind];

  const resolver: Resolver<FormValues> = async (values) => {
    if (!entityRef.current) return { values, errors: {} };
    try {
      const next = fromForm(entityRef.current, kind, values, initial.current, s);
      const r = schema.safeParse(next);
      const issues = r.success ? [] : r.error.issues.filter((i) => !isLinkIssue(kind, i.path));
      if (issues.length === 0) return { values, errors: {} };
      const errors: FieldErrors<FormValues> = {};
      for (const i of issues) {
        const key = issueKey(kind, i.path) ?? "root";
        const def = FIELDS[kind].find((f) => f.name.replaceAll(".", "__") === key);
        errors[key] ??= { type: "schema", message: def ? `${def.label} ${i.message}` : `${i.path.join(".")}: ${i.message}` };
      }
      return { values: {}, errors };
    } catch (e) {
      if (e instanceof FormFieldError) return { values: {}, errors: { [e.key]: { type: "number", message: e.message } } };
      throw e;
    }
  };

  const form = useForm<FormValues>({ defaultValues: initial.current, resolver, mode: "onChange" });

  // Undo, a merge from the server or an edit elsewhere replaced the entity: show its values.
  useEffect(() => {
    if (entity && entity !== committed.current) {
      committed.current = entity;
      initial.current = toForm(entity, kind, s);
      form.reset(initial.current);
    }
  }, [entity, kind, s, form]);

  useEffect(() => {
    const sub = form.watch((values, { name }) => {
      if (!name || !entityRef.current) return;
      try {
        const next = fromForm(entityRef.current, kind, values as FormValues, initial.current, s);
        const r = schema.safeParse(next);
        if (r.success || r.error.issues.every((i) => isLinkIssue(kind, i.path))) {
          committed.current = next;
          onChange(next, `${nid}:${name}`);
        }
      } catch (e) {
        if (!(e instanceof FormFieldError)) throw e;
      }
    });
    return () => sub.unsubscribe();
  }, [form, kind, s, schema, nid, onChange]);

  const modelErrors = useMemo(() => {
    const byKey: Record<string, string> = {};
    const loose: string[] = [];
    for (const p of problems) {
      const key = p.field ? issueKey(kind, splitField(p.field)) : null;
      if (key) byKey[key] ??= p.message;
      else loose.push(p.field ? `${p.field}: ${p.message}` : p.message);
    }
    return { byKey, loose };
  }, [problems, kind]);

  if (!entity) return null;
  const errors = form.formState.errors;
  const visible = FIELDS[kind].filter((f) => !f.when || f.when(entity));
  const commitRaw = (next: object) => {
    committed.current = next;
    onChange(next, `${nid}:links`);
  };

  return (
    <section aria-label="Inspector" className="flex flex-col gap-3 p-3">
      <header className="flex items-baseline justify-between gap-2">
        <h3 className="text-sm font-semibold">
          <span className="capitalize">{kind}</span> <span className="font-mono text-muted">{String(entity.tag ?? entity.name ?? entity.id)}</span>
        </h3>
        {canEdit ? (
          <Button variant="danger" className="!px-2 !py-0.5 text-xs" onClick={onDelete}>
            Delete
          </Button>
        ) : (
          <span className="text-xs text-muted">read-only</span>
        )}
      </header>
      {modelErrors.loose.length || errors.root ? (
        <ul role="alert" className="rounded border border-danger/50 bg-danger/5 p-2 text-xs text-danger">
          {errors.root?.message ? <li>⚠ {errors.root.message}</li> : null}
          {modelErrors.loose.map((m) => (
            <li key={m}>⚠ {m}</li>
          ))}
        </ul>
      ) : null}
      <form className="grid grid-cols-1 gap-2" onSubmit={(e) => e.preventDefault()} noValidate>
        {visible.map((f) => (
          <FormField key={f.name} def={f} s={s} disabled={!canEdit} register={form.register} error={(errors[f.name.replaceAll(".", "__")]?.message as string | undefined) ?? modelErrors.byKey[f.name.replaceAll(".", "__")]} nid={nid} />
        ))}
      </form>
      <Links kind={kind} entity={entity} doc={doc} disabled={!canEdit} onChange={commitRaw} nid={nid} />
      {kind === "room" ? <Envelope entity={entity} disabled={!canEdit} onChange={commitRaw} nid={nid} /> : null}
      <JsonEditor key={`${nid}:${JSON.stringify(entity).length}`} entity={entity} schema={schema} disabled={!canEdit} onApply={commitRaw} />
    </section>
  );
}

function FormField({ def, s, disabled, register, error, nid }: { def: FieldDef; s: UnitSystem; disabled: boolean; register: ReturnType<typeof useForm<FormValues>>["register"]; error?: string; nid: string }) {
  const key = def.name.replaceAll(".", "__");
  const id = `insp-${nid.replace(/[^a-z0-9]/gi, "-")}-${key}`;
  const unit = unitLabel(def, s);
  const cls = `w-full rounded border bg-surface px-2 py-1 text-sm text-ink outline-none focus:border-accent ${error ? "border-danger" : "border-line"}`;
  return (
    <div className="flex flex-col gap-0.5">
      <label htmlFor={id} className="text-xs font-medium text-muted">
        {def.label}
      </label>
      <div className="flex items-center gap-2">
        {def.type === "select" ? (
          <select id={id} className={cls} disabled={disabled} aria-invalid={error ? true : undefined} {...register(key)}>
            {def.optional ? <option value="">(default)</option> : null}
            {def.options!.map((o) => (
              <option key={o} value={o}>
                {OPTION_WORDS[o] ?? o}
              </option>
            ))}
          </select>
        ) : (
          <input
            id={id}
            className={`${cls} ${def.type === "number" ? "text-right font-mono" : ""}`}
            inputMode={def.type === "number" ? "decimal" : undefined}
            disabled={disabled}
            placeholder={def.optional ? "default" : undefined}
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? `${id}-err` : def.hint ? `${id}-hint` : undefined}
            {...register(key)}
          />
        )}
        {unit ? <span className="min-w-12 text-xs text-muted">{unit}</span> : null}
      </div>
      {error ? (
        <p id={`${id}-err`} role="alert" className="text-xs text-danger">
          ⚠ {error}
        </p>
      ) : def.hint ? (
        <p id={`${id}-hint`} className="text-[11px] text-muted">
          {def.hint}
        </p>
      ) : null}
    </div>
  );
}

/** The node's links as selects: connecting from the keyboard, and a list of what it joins. */
function Links({ kind, entity, doc, disabled, onChange, nid }: { kind: EditKind; entity: Record<string, unknown>; doc: CanvasDoc; disabled: boolean; onChange: (e: object) => void; nid: string }) {
  const rooms = doc.rooms.map((r) => ({ value: r.id, label: r.name }));
  const sel = (label: string, value: string, options: { value: string; label: string }[], set: (v: string) => void, key: string) => {
    const id = `link-${nid.replace(/[^a-z0-9]/gi, "-")}-${key}`;
    return (
      <div className="flex flex-col gap-0.5" key={key}>
        <label htmlFor={id} className="text-xs font-medium text-muted">
          {label}
        </label>
        <select id={id} className="rounded border border-line bg-surface px-2 py-1 text-sm" value={value} disabled={disabled} onChange={(e) => set(e.target.value)}>
          <option value="">(not connected)</option>
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      </div>
    );
  };
  let body: React.ReactNode = null;
  if (kind === "door") {
    const sides = entity.sides as [string, string];
    const opts = [{ value: OUTDOORS, label: "Outdoors" }, ...rooms];
    // The walls of the rooms the door joins: its area comes out of the one it sits in.
    const walls = doc.rooms
      .filter((r) => sides.includes(r.id))
      .flatMap((r) =>
        ((r.surfaces ?? []) as SurfaceLike[]).flatMap((sf, j) =>
          sf.kind === "wall" ? [{ value: `${r.id}:${j}`, label: `${r.name}: ${sf.label ?? `wall ${sf.orientation ?? ""}`.trim()} (surface ${j + 1})` }] : [],
        ),
      );
    const wall = entity.wall as { roomId: string; surfaceIndex: number } | undefined;
    body = [
      ...[0, 1].map((k) =>
        sel(k === 0 ? "Opens from" : "Opens to", sides[k] ?? "", opts, (v) => onChange({ ...entity, sides: k === 0 ? [v, sides[1]] : [sides[0], v] }), `side${k}`),
      ),
      sel("Sits in wall", wall ? `${wall.roomId}:${wall.surfaceIndex}` : "", walls, (v) => {
        const next = { ...entity };
        if (!v) delete next.wall;
        else {
          const i = v.lastIndexOf(":");
          next.wall = { roomId: v.slice(0, i), surfaceIndex: Number(v.slice(i + 1)) };
        }
        onChange(next);
      }, "wall"),
    ];
  } else if (kind === "evaporator") {
    body = [
      sel("Sits in room", String(entity.roomId ?? ""), rooms, (v) => onChange({ ...entity, roomId: v }), "room"),
      sel("Feeds circuit", String(entity.circuitId ?? ""), circuits(doc).map((c) => ({ value: c.id, label: `${c.tag} (${c.refrigerant})` })), (v) => onChange({ ...entity, circuitId: v }), "circuit"),
    ];
  } else if (kind === "circuit") {
    const hr = entity.heatRejection as { to: string; condenserId?: string; circuitId?: string };
    const value = hr.to === "condenser" ? (hr.condenserId ? `cd:${hr.condenserId}` : "") : `c:${hr.circuitId}`;
    const opts = [
      ...condensers(doc).map((c) => ({ value: `cd:${c.id}`, label: `Condenser ${c.tag}` })),
      ...circuits(doc)
        .filter((c) => c.id !== entity.id)
        .map((c) => ({ value: `c:${c.id}`, label: `Cascade into ${c.tag}` })),
    ];
    body = sel(
      "Rejects heat to",
      value,
      opts,
      (v) => onChange({ ...entity, heatRejection: v.startsWith("c:") ? { to: "circuit", circuitId: v.slice(2) } : { to: "condenser", condenserId: v.slice(3) } }),
      "reject",
    );
  } else if (kind === "room") {
    const evs = evaporators(doc).filter((e) => e.roomId === entity.id);
    const doors = doc.doors.filter((d) => d.sides.includes(String(entity.id)));
    body = (
      <p className="text-xs text-muted">
        {evs.length ? `Cooled by ${evs.map((e) => e.tag).join(", ")}` : "No evaporator yet: add one and connect it to this room."}
        {doors.length ? ` · doors: ${doors.map((d) => d.name || d.id).join(", ")}` : ""}
      </p>
    );
  }
  if (!body) return null;
  return (
    <fieldset className="flex flex-col gap-2 border-t border-line pt-2">
      <legend className="text-xs font-semibold text-muted">Connections</legend>
      {body}
    </fieldset>
  );
}

/**
 * The room's walls and roof as the solar allowance sees them: which way each wall faces (the
 * eight compass directions) and the colour of every surface open to the sky (light, medium,
 * dark). Other surface inputs are in the JSON below.
 */
function Envelope({ entity, disabled, onChange, nid }: { entity: Record<string, unknown>; disabled: boolean; onChange: (e: object) => void; nid: string }) {
  const surfaces = (entity.surfaces ?? []) as SurfaceLike[];
  const rows = surfaces.map((sf, j) => ({ sf, j })).filter(({ sf }) => sf.kind === "wall" || sf.otherSide === "outdoors");
  if (rows.length === 0) return null;
  const set = (j: number, patch: Partial<SurfaceLike>) => {
    const next = surfaces.map((x, i) => {
      if (i !== j) return x;
      const y: SurfaceLike = { ...x, ...patch };
      if (y.orientation === "") delete y.orientation;
      return y;
    });
    onChange({ ...entity, surfaces: next });
  };
  const base = `env-${nid.replace(/[^a-z0-9]/gi, "-")}`;
  const selCls = "rounded border border-line bg-surface px-1 py-0.5 text-xs";
  return (
    <fieldset className="flex flex-col gap-1 border-t border-line pt-2">
      <legend className="text-xs font-semibold text-muted">Walls and roof (sun)</legend>
      <table className="text-xs">
        <thead className="text-left text-muted">
          <tr>
            <th className="font-medium">Surface</th>
            <th className="font-medium">Faces</th>
            <th className="font-medium">Colour</th>
          </tr>
        </thead>
        <tbody>
          {rows.map(({ sf, j }) => (
            <tr key={j}>
              <td className="py-0.5 pr-1">
                {j + 1}. {sf.label ?? sf.kind}
                {sf.otherSide === "outdoors" ? "" : " (inside)"}
              </td>
              <td className="py-0.5 pr-1">
                {sf.kind === "wall" ? (
                  <select aria-label={`Surface ${j + 1} faces`} id={`${base}-o${j}`} className={selCls} value={sf.orientation ?? ""} disabled={disabled} onChange={(e) => set(j, { orientation: e.target.value })}>
                    <option value="">(none)</option>
                    {FACINGS.map((o) => (
                      <option key={o} value={o}>
                        {o}
                      </option>
                    ))}
                  </select>
                ) : (
                  <span className="text-muted">horizontal</span>
                )}
              </td>
              <td className="py-0.5">
                {sf.otherSide === "outdoors" ? (
                  <select aria-label={`Surface ${j + 1} colour`} id={`${base}-c${j}`} className={selCls} value={sf.colour ?? "medium"} disabled={disabled} onChange={(e) => set(j, { colour: e.target.value })}>
                    {COLOURS.map((c) => (
                      <option key={c} value={c}>
                        {c}
                      </option>
                    ))}
                  </select>
                ) : (
                  <span className="text-muted">no sun</span>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="text-[11px] text-muted">Sun allowance from the handbook table by colour: E/W walls, S wall, flat roof; NE, SE, SW, NW walls take the mean of their neighbours.</p>
    </fieldset>
  );
}

/** Every input of the item (surfaces, products, schedules …) as JSON, checked by the engine's schema. */
function JsonEditor({ entity, schema, disabled, onApply }: { entity: object; schema: { safeParse: (v: unknown) => { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } } }; disabled: boolean; onApply: (e: object) => void }) {
  const [text, setText] = useState(() => JSON.stringify(entity, null, 2));
  const [errs, setErrs] = useState<string[]>([]);
  const apply = () => {
    let v: unknown;
    try {
      v = JSON.parse(text);
    } catch (e) {
      setErrs([`Not valid JSON: ${(e as Error).message}`]);
      return;
    }
    const r = schema.safeParse(v);
    if (!r.success) {
      setErrs(r.error!.issues.map((i) => `${i.path.join(".") || "(item)"}: ${i.message}`));
      return;
    }
    setErrs([]);
    onApply({ ...(v as object), id: (entity as { id: string }).id });
  };
  return (
    <details className="border-t border-line pt-2 text-xs">
      <summary className="cursor-pointer font-semibold text-muted">All inputs (JSON, SI units)</summary>
      <label className="sr-only" htmlFor="insp-json">
        All inputs as JSON
      </label>
      <textarea id="insp-json" className="mt-2 h-64 w-full rounded border border-line bg-surface-2 p-2 font-mono text-[11px]" value={text} onChange={(e) => setText(e.target.value)} readOnly={disabled} spellCheck={false} />
      {errs.length ? (
        <ul role="alert" className="mt-1 text-danger">
          {errs.map((m) => (
            <li key={m}>⚠ {m}</li>
          ))}
        </ul>
      ) : null}
      {!disabled ? (
        <Button className="mt-1 !py-0.5 text-xs" onClick={apply}>
          Apply JSON
        </Button>
      ) : null}
    </details>
  );
}
