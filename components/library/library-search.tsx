"use client";
import { usePathname } from "next/navigation";
import { useEffect, useRef, useState, type KeyboardEvent } from "react";
import { BlockTable } from "@/components/block-table";
import { EmptyState } from "@/components/empty-state";
import { searchQueryString, useSearchBlocks, type SearchFilters, type SearchResult } from "@/lib/queries/search-blocks";
import { FacetGroup } from "./facet-group";
import { useDebounced } from "./use-debounced";
import { useLeavingPage } from "./use-leaving-page";

const FACETS: { facet: string; key: keyof SearchFilters }[] = [
  { facet: "category", key: "category" }, { facet: "badge", key: "badge" }, { facet: "tags", key: "tag" },
  { facet: "team", key: "team" }, { facet: "approved", key: "approved" },
];

/** Search as you type: debounced, the previous results stay on screen while the next ones load. */
export function LibrarySearch({ initial, initialFilters }: { initial: SearchResult | null; initialFilters: SearchFilters }) {
  const pathname = usePathname();
  const leaving = useLeavingPage();
  const [q, setTypedQ] = useState(initialFilters.q ?? "");
  const [filters, setTypedFilters] = useState<SearchFilters>({ ...initialFilters, q: undefined });
  // Searching again means staying: the address follows the search once more.
  const setQ = (v: string) => { leaving.current = false; setTypedQ(v); };
  const setFilters = (f: (prev: SearchFilters) => SearchFilters) => { leaving.current = false; setTypedFilters(f); };
  const debouncedQ = useDebounced(q.trim(), 200);
  const current = { ...filters, q: debouncedQ || undefined };
  const qs = searchQueryString(current);
  // The server rendered the first search; the query starts from it instead of asking again.
  const [initialFor] = useState(qs);
  const query = useSearchBlocks(current, { for: initialFor, data: initial });
  const data = query.data ?? initial;

  // Keep the address in step with the search, so a result list can be shared and the back button returns to it.
  // The browser's own history call: Next keeps its router in step without fetching the page again, so a
  // keystroke costs one request (the API search), not a second server render of this page. Not once a link on
  // the page was followed: that navigation may still wait for its page, and this call would cancel it.
  useEffect(() => {
    if (leaving.current) return;
    const next = qs ? `${pathname}?${qs}` : pathname;
    if (`${window.location.pathname}${window.location.search}` !== next) window.history.replaceState(null, "", next);
  }, [qs, pathname, leaving]);

  // Arrow keys walk from the box down the result titles and back, so a search is opened without a mouse.
  const results = useRef<HTMLDivElement>(null);
  const resultLinks = () => [...(results.current?.querySelectorAll<HTMLAnchorElement>("tbody a[href^='/blocks/']") ?? [])];
  const fromBox = (e: KeyboardEvent) => {
    if (e.key !== "ArrowDown") return;
    const first = resultLinks()[0];
    if (first) { e.preventDefault(); first.focus(); }
  };
  const inResults = (e: KeyboardEvent) => {
    if (e.key !== "ArrowDown" && e.key !== "ArrowUp") return;
    const links = resultLinks();
    const at = links.indexOf(document.activeElement as HTMLAnchorElement);
    if (at < 0) return;
    e.preventDefault();
    const next = at + (e.key === "ArrowDown" ? 1 : -1);
    if (next < 0) document.getElementById("library-q")?.focus();
    else links[Math.min(next, links.length - 1)].focus();
  };

  const [facetsOpen, setFacetsOpen] = useState(false);
  const activeFilters = FACETS.filter(({ key }) => filters[key]).length;

  const set = (key: keyof SearchFilters) => (v: string | undefined) => setFilters((f) => ({ ...f, [key]: v }));

  return (
    <section aria-label="Search the library" className="grid gap-6 md:grid-cols-[13rem_1fr]">
      <div className="md:col-span-2">
        <label htmlFor="library-q" className="mb-1 block text-sm font-medium">Search blocks</label>
        <div className="flex flex-wrap gap-2">
          <input id="library-q" type="search" value={q} onChange={(e) => setQ(e.target.value)} onKeyDown={fromBox} autoComplete="off"
            placeholder="limiter, Wien bridge, 1 kHz low-pass…" aria-describedby="library-count library-keys"
            className="min-w-0 flex-1 rounded border border-rule bg-panel px-3 py-2 text-base shadow-sm" />
          <label htmlFor="library-sort" className="sr-only">Sort</label>
          <select id="library-sort" value={filters.sort ?? ""} onChange={(e) => set("sort")(e.target.value || undefined)}
            className="rounded border border-rule bg-panel px-2 py-2 text-sm">
            <option value="">Best match</option>
            <option value="updated">Last change</option>
            <option value="title">Title</option>
          </select>
        </div>
        <p id="library-keys" className="sr-only">Press the down arrow to move to the results.</p>
        <p id="library-count" className="mt-1 text-xs text-graphite" aria-live="polite">
          {query.isError ? `Search failed: ${query.error.message}` : data ? `${data.estimatedTotal} block${data.estimatedTotal === 1 ? "" : "s"}` : "Searching…"}
          {query.isFetching ? " · updating" : ""}
        </p>
      </div>
      {/* On a phone the filters fold away so the results come first. */}
      <button type="button" onClick={() => setFacetsOpen((o) => !o)} aria-expanded={facetsOpen} aria-controls="library-facets"
        className="justify-self-start rounded border border-rule bg-panel px-3 py-1 text-sm md:hidden">
        {facetsOpen ? "Hide filters" : "Filters"}{activeFilters ? ` (${activeFilters} set)` : ""}
      </button>
      <aside id="library-facets" aria-label="Narrow the results" className={`${facetsOpen ? "grid" : "hidden"} grid-cols-2 gap-4 md:block md:space-y-4`}>
        {FACETS.map(({ facet, key }) => (
          <FacetGroup key={facet} name={facet} counts={data?.facets?.[facet] ?? {}} value={filters[key]} onChange={set(key)} />
        ))}
      </aside>
      <div ref={results} onKeyDown={inResults} className={query.isPlaceholderData ? "opacity-70 transition-opacity" : ""}>
        {data && data.items.length > 0 ? (
          <BlockTable rows={data.items} caption="Search results" />
        ) : data ? (
          <EmptyState title="No block matches.">Try fewer words, or clear a filter on the left.</EmptyState>
        ) : null}
      </div>
    </section>
  );
}
