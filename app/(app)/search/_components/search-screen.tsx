"use client";

import Link from "next/link";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useEffect, useMemo, useRef, useState } from "react";
import { MarkedText } from "@/components/marked-text";
import { documentTypes } from "@/lib/domain/vocabulary";
import { ApiError } from "@/lib/client/api";
import { documentTypeLabels } from "@/lib/domain/validation/library";
import { useSearch, type SearchHitDto, type SearchInput, type SearchResponseDto } from "./use-search";

function useDebounced<T>(value: T, ms: number): T {
  const [debounced, setDebounced] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setDebounced(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return debounced;
}

export function readerLink(hit: Pick<SearchHitDto, "manualId" | "revisionId" | "page">, q: string) {
  return `/library/${hit.manualId}/${hit.revisionId}/${hit.page}?q=${encodeURIComponent(q)}`;
}

/** 'a', 'a' or 'b', 'a', 'b' or 'c': the words no page has, as said. */
function wordList(words: string[]): string {
  const quotedWords = words.map((w) => `'${w}'`);
  return quotedWords.length < 2 ? (quotedWords[0] ?? "") : `${quotedWords.slice(0, -1).join(", ")} or ${quotedWords.at(-1)}`;
}

/** What the answer says in words: how many pages, and which words were not found. */
function summary(data: SearchResponseDto): string {
  const count = `${data.totalCapped ? "More than " : ""}${data.total} ${data.total === 1 ? "page" : "pages"}`;
  if (data.missing.length && !data.hits.length) return `No page has ${wordList(data.missing)}. Try another spelling or other words.`;
  if (data.total === 0) return "No page matches. Try fewer words or another spelling.";
  if (data.missing.length) return `No page has ${wordList(data.missing)}; showing pages with the other words (${count.toLowerCase()}).`;
  if (data.partial) {
    return data.hits.some((h) => !h.missing.length)
      ? `Few pages have every word: they come first, then pages with most of the words (${count.toLowerCase()}).`
      : `No page has all the words; showing pages with most of them (${count.toLowerCase()}).`;
  }
  return `${count} found`;
}

export function SearchScreen({ manuals }: { manuals: { id: string; title: string }[] }) {
  const router = useRouter();
  const pathname = usePathname();
  const url = useSearchParams();
  const [input, setInput] = useState<SearchInput>(() => ({
    q: url.get("q") ?? "",
    manual: url.get("manual") ?? "",
    type: url.get("type") ?? "",
    model: url.get("model") ?? "",
    ata: url.get("ata") ?? "",
  }));
  // Opened from a cart at an aircraft (?for=HL-TR1&model=HT-20): scoped to its model, and saying so.
  const [scopedFor] = useState(() => url.get("for"));
  const debounced = useDebounced(input, 250);
  const search = useSearch(debounced);
  const [active, setActive] = useState(-1);
  const results = useRef<HTMLOListElement>(null);

  // The query lives in the address, so a search can be shared or bookmarked.
  useEffect(() => {
    const params = new URLSearchParams(Object.entries(debounced).filter(([, v]) => v) as [string, string][]);
    const next = params.toString();
    if (next !== url.toString()) router.replace(next ? `${pathname}?${next}` : pathname, { scroll: false });
  }, [debounced, pathname, router, url]);

  const hits = useMemo(() => search.data?.hits ?? [], [search.data]);
  const groups = useMemo(() => {
    const byManual = new Map<string, { title: string; hits: { hit: SearchHitDto; index: number }[] }>();
    hits.forEach((hit, index) => {
      const group = byManual.get(hit.manualId) ?? { title: hit.manualTitle, hits: [] };
      group.hits.push({ hit, index });
      byManual.set(hit.manualId, group);
    });
    return [...byManual.entries()];
  }, [hits]);

  const set = (key: keyof SearchInput) => (event: { target: { value: string } }) => {
    setActive(-1);
    setInput((v) => ({ ...v, [key]: event.target.value }));
  };

  const onKeyDown = (event: React.KeyboardEvent) => {
    if (!hits.length) return;
    if (event.key === "ArrowDown" || event.key === "ArrowUp") {
      event.preventDefault();
      const next = event.key === "ArrowDown" ? Math.min(active + 1, hits.length - 1) : Math.max(active - 1, 0);
      setActive(next);
      results.current?.querySelector<HTMLElement>(`[data-index="${next}"]`)?.scrollIntoView({ block: "nearest" });
    } else if (event.key === "Enter" && active >= 0 && hits[active]) {
      event.preventDefault();
      router.push(readerLink(hits[active]!, debounced.q));
    }
  };

  const error = search.error instanceof ApiError ? search.error.message : search.error ? "Search failed. Try again." : null;

  return (
    <div className="flex flex-col gap-4" onKeyDown={onKeyDown}>
      {scopedFor && input.model ? (
        <p className="notice-todo flex flex-wrap items-center gap-3" role="status">
          <span className="mr-auto">
            Showing what applies to {scopedFor} (model {input.model}), and general documents are left out.
          </span>
          <button type="button" className="btn btn-secondary" onClick={() => setInput((i) => ({ ...i, model: "" }))}>
            Search everything
          </button>
        </p>
      ) : null}
      <div className="panel flex flex-col gap-3">
        <label htmlFor="search-q" className="label text-lg">
          What are you looking for?
        </label>
        <input
          id="search-q"
          type="search"
          className="input text-xl"
          placeholder='e.g. magneto timing, tire pressure, "cable tension"'
          value={input.q}
          onChange={set("q")}
          autoFocus
          autoComplete="off"
          role="combobox"
          aria-expanded={hits.length > 0}
          aria-controls="search-results"
          aria-activedescendant={active >= 0 ? `hit-${active}` : undefined}
          aria-describedby="search-help"
        />
        <p id="search-help" className="hint">
          Typos are forgiven. Use &quot;quotes&quot; for a phrase and -word to leave a word out. An ATA code such as 32-10-00 goes to that
          section. Arrow keys move through the results; Enter opens one.
        </p>
        <div className="grid gap-3 md:grid-cols-4">
          <div className="field">
            <label htmlFor="search-manual" className="label">
              Manual
            </label>
            <select id="search-manual" className="input" value={input.manual} onChange={set("manual")}>
              <option value="">All manuals</option>
              {manuals.map((m) => (
                <option key={m.id} value={m.id}>
                  {m.title}
                </option>
              ))}
            </select>
          </div>
          <div className="field">
            <label htmlFor="search-type" className="label">
              Document type
            </label>
            <select id="search-type" className="input" value={input.type} onChange={set("type")}>
              <option value="">All types</option>
              {documentTypes.map((t) => (
                <option key={t} value={t}>
                  {documentTypeLabels[t]}
                </option>
              ))}
            </select>
          </div>
          <div className="field">
            <label htmlFor="search-model" className="label">
              Model
            </label>
            <input id="search-model" className="input" value={input.model} onChange={set("model")} placeholder="e.g. HT-20" />
          </div>
          <div className="field">
            <label htmlFor="search-ata" className="label">
              ATA chapter
            </label>
            <input
              id="search-ata"
              className="input"
              inputMode="numeric"
              maxLength={2}
              value={input.ata}
              onChange={set("ata")}
              placeholder="e.g. 32 or 5"
            />
          </div>
        </div>
      </div>

      <div aria-live="polite" className="min-h-7">
        {error ? (
          <p className="notice-error" role="alert">
            {error}
          </p>
        ) : search.data && debounced.q ? (
          <p>
            {summary(search.data)}
            {search.isFetching ? " · updating…" : ""}
          </p>
        ) : null}
      </div>

      {search.data?.goesTo.length && debounced.q ? (
        <nav aria-label="Manual sections" className="flex flex-col gap-2">
          {search.data.goesTo.map((jump) => (
            <Link
              key={jump.revisionId}
              href={readerLink(jump, debounced.q)}
              className="panel flex flex-col gap-1 border-teal no-underline text-ink hover:border-amber"
            >
              <span className="text-xl font-semibold text-teal underline">
                Go to {jump.code}: {jump.heading.replace(jump.code, "").trim() || "the section"}
              </span>
              <span>
                {jump.manualTitle} · {jump.revisionLabel}
                {jump.current ? "" : " (superseded)"} · page {jump.page}
              </span>
            </Link>
          ))}
        </nav>
      ) : null}

      <ol id="search-results" ref={results} role="listbox" aria-label="Search results" className="flex flex-col gap-5">
        {groups.map(([manualId, group]) => (
          <li key={manualId} role="presentation" className="flex flex-col gap-2">
            <h2>{group.title}</h2>
            <ol role="presentation" className="flex flex-col gap-2">
              {group.hits.map(({ hit, index }) => (
                <li key={`${hit.revisionId}-${hit.page}`} role="presentation">
                  <Link
                    id={`hit-${index}`}
                    data-index={index}
                    role="option"
                    aria-selected={index === active}
                    href={readerLink(hit, debounced.q)}
                    className={`panel flex flex-col gap-1 no-underline text-ink hover:border-teal ${index === active ? "outline outline-3 outline-amber" : ""}`}
                  >
                    <span className="font-semibold text-teal underline">
                      Page {hit.page} · {hit.revisionLabel}
                      {hit.current ? "" : " (superseded)"}
                    </span>
                    <span className="whitespace-pre-line text-[0.95rem]">
                      <MarkedText snippet={hit.snippet} />
                    </span>
                    {hit.missing.length ? <span className="hint">Does not have: {hit.missing.join(", ")}</span> : null}
                  </Link>
                </li>
              ))}
            </ol>
          </li>
        ))}
      </ol>
    </div>
  );
}
