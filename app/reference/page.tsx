/// The in-app reference of the notation, generated from the grammar's signature table
/// (the same table the checker and the completion read), so it never drifts from them.
import Link from "next/link";
import { FUNCTIONS, PROPERTIES, RING_OPTIONS, type Overload, type PropertySig } from "@/grammar/signatures";
import { typeToString } from "@/grammar/types";
import { ReferenceSearch } from "./reference-search";

export const metadata = { title: "Ringside — notation reference" };

const overloadText = (name: string, o: Overload) =>
  `${name}(${[...o.params.map((p) => `${p.name}: ${typeToString(p.type)}`), ...(o.rest ? [`…${o.rest.name}: ${typeToString(o.rest.type)}`] : [])].join(", ")}) → ${typeToString(o.result)}`;

const propertyText = (p: PropertySig) =>
  `.${p.name}${p.params ? `(${p.params.map((q) => `${q.name}: ${typeToString(q.type)}`).join(", ")})` : ""} → ${typeToString(p.result)}`;

/// The reference page: functions with their options, then properties by type.
export default function ReferencePage() {
  const owners = [...new Set(PROPERTIES.map((p) => p.owner))];
  return (
    <main className="mx-auto flex max-w-4xl flex-col gap-8 px-6 py-8">
      <header className="flex items-baseline justify-between">
        <h1 className="text-2xl font-semibold">Notation reference</h1>
        <Link href="/" className="text-sm text-ink-soft underline">
          Back to the console
        </Link>
      </header>
      <ReferenceSearch />

      <section aria-labelledby="ref-functions" data-ref-group>
        <h2 id="ref-functions" className="mb-3 text-lg font-semibold">
          Functions
        </h2>
        <dl className="flex flex-col gap-4">
          {FUNCTIONS.map((f) => (
            <div key={f.name} id={`fn-${f.name}`} data-ref-entry>
              <dt className="font-mono text-sm font-semibold">
                {f.overloads.map((o, i) => (
                  <div key={i}>{overloadText(f.name, o)}</div>
                ))}
              </dt>
              <dd className="mt-1 text-sm">
                {f.description}
                {f.options.length > 0 && (
                  <ul className="mt-1 list-disc pl-5">
                    {f.options.map((o) => (
                      <li key={o.name}>
                        <code className="font-mono">
                          {o.name} = {typeToString(o.type)}
                        </code>
                        {o.default !== null && <> (default {o.default})</>}: {o.description}
                      </li>
                    ))}
                  </ul>
                )}
                <div className="mt-1 text-ink-soft">
                  e.g. <code className="font-mono">{f.example}</code>
                </div>
              </dd>
            </div>
          ))}
        </dl>
      </section>

      <section aria-labelledby="ref-properties" data-ref-group>
        <h2 id="ref-properties" className="mb-3 text-lg font-semibold">
          Properties
        </h2>
        {owners.map((owner) => (
          <div key={owner} className="mb-5" data-ref-group>
            <h3 className="mb-1 font-semibold">{owner}</h3>
            <dl className="grid grid-cols-[minmax(12rem,auto)_1fr] gap-x-4 gap-y-1 text-sm">
              {PROPERTIES.filter((p) => p.owner === owner).map((p) => (
                <div key={p.name} className="contents" data-ref-entry>
                  <dt className="font-mono">{propertyText(p)}</dt>
                  <dd>{p.description}</dd>
                </div>
              ))}
            </dl>
          </div>
        ))}
      </section>

      <section aria-labelledby="ref-ring-options" data-ref-group>
        <h2 id="ref-ring-options" className="mb-3 text-lg font-semibold">
          Ring options
        </h2>
        <dl className="grid grid-cols-[minmax(12rem,auto)_1fr] gap-x-4 gap-y-1 text-sm">
          {RING_OPTIONS.map((o) => (
            <div key={o.name} className="contents" data-ref-entry>
              <dt className="font-mono">
                {o.name} = {o.values}
              </dt>
              <dd>
                {o.description} (default {o.default})
              </dd>
            </div>
          ))}
        </dl>
      </section>
    </main>
  );
}
