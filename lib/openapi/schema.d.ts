// Generated from /api/v1/openapi.json by `npm run -s openapi:types`. Do not edit.
export interface paths {
    "/api/v1/blocks": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * Search the library
         * @description Full-text search over the blocks the caller may read, with filters. Pages follow nextCursor.
         */
        get: operations["searchBlocks"];
        put?: never;
        /** Create a block from a block file */
        post: operations["createBlock"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/api/v1/blocks/{slug}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * The head version of a block
         * @description Strong ETag over the exact body; Cache-Control no-cache, so clients revalidate with If-None-Match and get 304 while nothing changed.
         */
        get: operations["getBlock"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/api/v1/blocks/{slug}/badge.svg": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** The hallmark of the head (or ?version=n) as an embeddable SVG */
        get: operations["getBadge"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/api/v1/blocks/{slug}/evaluate": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Check the head (or a pinned version) with draft values, or an edited block file of this block; nothing is stored
         * @description JSON: without simulate the checks that need a simulation are skipped and the status is never verified. A block file (text/markdown or multipart `file`) of this block is checked as it is, with simulations unless ?simulate=false. Engine calls are budgeted per minute: per token or signed-in user, and for signed-out callers per block and overall; an evaluation costs 1 point, with simulate 6, a retune 2 (defaults 60 points per caller, 20 per block and 60 overall signed out).
         */
        post: operations["evaluateBlock"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/api/v1/blocks/{slug}/forks": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /** Fork a block, optionally with new values, title, slug or team */
        post: operations["forkBlock"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/api/v1/blocks/{slug}/retune": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /** Solve one parameter so a quantity reaches a target, snapped to an E-series value */
        post: operations["retuneBlock"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/api/v1/blocks/{slug}/versions": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** The versions of a block, newest first */
        get: operations["listVersions"];
        put?: never;
        /** Add a version: new parameter values as JSON, or a whole block file with ?baseVersion=n */
        post: operations["addVersion"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/api/v1/blocks/{slug}/versions/{n}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * One immutable version
         * @description The text of a version never changes, but its badge, approval and report do: the JSON carries a strong ETag with no-cache. ?format=md and ?format=spice are immutable and cached for a year.
         */
        get: operations["getVersion"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/api/v1/evaluate": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Check a block file that is not in the library yet (CI, before a push); nothing is stored
         * @description For a member of the team (any role, any token scope); simulations run unless ?simulate=false. Budgeted like evaluate.
         */
        post: operations["evaluateFile"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/api/v1/health": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** Health of the database, search and workers */
        get: operations["getHealth"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/api/v1/models": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** The team's model files (every team of a signed-in user; a token's own team by default) and the shared library */
        get: operations["listModels"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/api/v1/models/{team}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        get?: never;
        put?: never;
        /**
         * Upload a model file: a new immutable version (authors and above)
         * @description Checked like a netlist before anything is stored (no .control, shell, analyses, includes outside the library, file-reading code models); a refusal is a 422 whose `errors` carry the file's line. Heads of the team's blocks that include the file turn stale and are queued for verification; `reverify` lists them. The same text as the newest version is a 409.
         */
        post: operations["uploadModel"];
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/api/v1/models/{team}/{name}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /**
         * One model file: the newest version's text, its versions and the blocks that include it; `?version=n` gives one immutable version
         * @description Without `version`: Cache-Control no-cache and an ETag over the body (its users' badges change). With `version`: that version alone, cached for a year. Team `shared` is the shared model library, readable by anyone.
         */
        get: operations["getModel"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/api/v1/openapi.json": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** This document */
        get: operations["getOpenApi"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
    "/api/v1/runs/{id}": {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        /** One check run; poll until status is done or error */
        get: operations["getRun"];
        put?: never;
        post?: never;
        delete?: never;
        options?: never;
        head?: never;
        patch?: never;
        trace?: never;
    };
}
export type webhooks = Record<string, never>;
export interface components {
    schemas: {
        /**
         * @description State of one version's checks
         * @enum {string}
         */
        Badge: "unchecked" | "pending" | "verified" | "failing" | "error" | "stale";
        Block: {
            approved: boolean;
            /** @description Archived blocks stay readable but take no new versions */
            archived: boolean;
            /** @description Name of the version's author */
            author: string;
            badge: components["schemas"]["Badge"];
            /** @enum {string} */
            category: "oscillator" | "limiter" | "filter" | "amplifier" | "reference" | "power" | "interface" | "other";
            checkCounts: components["schemas"]["CheckCounts"];
            contentHash: string;
            /** Format: date-time */
            createdAt: string;
            forkedFrom: {
                slug: string;
                version: number;
            } | null;
            /** @description mains, high-voltage, high-current, heat: the page shows cautions */
            hazard: string[];
            headVersion: number;
            lineage: components["schemas"]["Lineage"];
            /** @description The markdown body after the frontmatter, fences included */
            markdown: string;
            netlist: string;
            /** @description The design note without the spice and check fences */
            note: string;
            params: components["schemas"]["Param"][];
            report: components["schemas"]["Report"];
            run: components["schemas"]["RunRef"] & (Record<string, never> | null);
            script: string;
            slug: string;
            summary: string;
            tags: string[];
            team: string;
            title: string;
            version: number;
            /** @enum {string} */
            visibility: "team" | "public";
        };
        BlockSummary: {
            approved: boolean;
            badge: components["schemas"]["Badge"];
            category: string;
            highlight?: {
                summary: {
                    match: boolean;
                    text: string;
                }[];
                title: {
                    match: boolean;
                    text: string;
                }[];
            };
            slug: string;
            summary: string;
            tags: string[];
            team: string;
            title: string;
            updatedAt: string;
            version: number;
            /** @enum {string} */
            visibility: "team" | "public";
        };
        CheckCounts: {
            error: number;
            fail: number;
            pass: number;
            skipped: number;
        } | null;
        Created: {
            run: components["schemas"]["RunRef"];
            slug: string;
            version: number;
        };
        /** @description One validation issue */
        Issue: {
            /** @description Line in the block file, counted from 1 */
            line?: number;
            message: string;
            /** @description Dotted path of the offending request field */
            path?: string;
        };
        Lineage: {
            forkedFrom: {
                slug: string;
                title: string;
                version: number;
            } | null;
            forks: {
                fromVersion: number;
                slug: string;
                title: string;
            }[];
            /** @description Versions the parent gained since the fork */
            parentNewerVersions: number;
        };
        ModelFile: components["schemas"]["ModelSummary"] & {
            /** @description The newest version's number */
            head: number;
            text: string;
            /** @description Heads of blocks the caller may read that include the file, with their badges */
            usedBy: {
                badge: string;
                slug: string;
                team: string;
                title: string;
                version: number;
            }[];
            versions: {
                author: string;
                createdAt: string;
                message: string;
                number: number;
                sha256: string;
            }[];
        };
        ModelSummary: {
            /** @description The .subckt and .model names the file defines */
            defines: {
                /** @enum {string} */
                kind: "subckt" | "model";
                name: string;
                type?: string;
            }[];
            name: string;
            sha256: string;
            /** @description Team slug, or `shared` */
            team: string;
            updatedAt: string | null;
            version: number;
        };
        ModelUpload: {
            name: string;
            /** @description Heads that use the file: now stale and queued for verification */
            reverify: {
                slug: string;
                version: number;
            }[];
            sha256: string;
            team: string;
            version: number;
        };
        /** @description One immutable version */
        ModelVersion: {
            author: string;
            createdAt: string;
            /** @description The .subckt and .model names the file defines */
            defines: {
                /** @enum {string} */
                kind: "subckt" | "model";
                name: string;
                type?: string;
            }[];
            message: string;
            name: string;
            sha256: string;
            /** @description Team slug, or `shared` */
            team: string;
            text: string;
            version: number;
        };
        Param: {
            name: string;
            note: string | null;
            /**
             * @description Percentage or absolute tolerance
             * @example 1%
             */
            tol: string | null;
            /**
             * @description SI unit name, empty for plain numbers
             * @example ohm
             */
            unit: string;
            /** @example 3.3 kohm */
            value: string;
        };
        /** @description RFC 9457 problem details */
        Problem: {
            detail: string;
            /** @description On 422: the validation issues */
            errors?: components["schemas"]["Issue"][];
            /** @description On a stale base (409): the current head version */
            head?: number;
            status: number;
            title: string;
            /**
             * Format: uri
             * @description Stable URI naming the kind of problem
             * @example https://assay.test/problems/not-found
             */
            type: string;
        };
        /** @description Report of the latest finished run of this version */
        Report: {
            checks: {
                corners?: {
                    limits: number[];
                    nominal: number;
                    quantity: string;
                    unit: string;
                    values: number[];
                };
                detail: string;
                label: string;
                line?: number;
                simulated?: boolean;
                /** @enum {string} */
                status: "pass" | "fail" | "error" | "skipped";
                worst?: {
                    corner: {
                        [key: string]: string;
                    };
                    detail: string;
                };
            }[];
            errors: {
                line?: number;
                message: string;
            }[];
            quantities: {
                [key: string]: {
                    /**
                     * @description Measured on a simulation result rather than computed by hand
                     * @enum {boolean}
                     */
                    simulated?: true;
                    /** @example 2.192 kHz */
                    text: string;
                    /** @example Hz */
                    unit: string;
                    /** @description Plain number in the named unit, no prefix */
                    value: number;
                };
            };
            simulations: {
                /** @enum {string} */
                analysis: "tran" | "ac" | "op" | "dc" | "noise" | "tf";
                cached?: boolean;
                ms: number;
                points: number;
            }[];
            slug: string;
            /** @enum {string} */
            status: "verified" | "failing" | "error" | "unchecked";
        } | null;
        RetuneResult: {
            report: components["schemas"]["Report"] & unknown;
            /**
             * @description Nearest value of the series
             * @example 10 kohm
             */
            snapped: string;
            /**
             * @description Solved value with its unit
             * @example 10.3 kohm
             */
            value: string;
        };
        Run: {
            badge: components["schemas"]["Badge"];
            /** Format: date-time */
            createdAt: string;
            durationMs: number | null;
            /** @description Why the run ended as error, or why an earlier attempt was retried */
            error: string | null;
            /** Format: date-time */
            finishedAt: string | null;
            /** Format: uuid */
            id: string;
            /** @description The model files the run simulated with (team files by version, shared files by sha256) */
            models?: {
                name: string;
                sha256: string;
                /** @enum {string} */
                source: "team" | "shared";
                version: number | null;
            }[] | null;
            /**
             * @description How far the run's simulations have come; done equals total once the run is done
             * @example {
             *       "done": 12,
             *       "total": 40
             *     }
             */
            progress: {
                /** @description Simulations finished */
                done: number;
                /** @description Simulations the run needs, as far as the engine has planned them; it may grow while the run is in progress */
                total: number;
            };
            report: components["schemas"]["Report"] & unknown;
            slug: string;
            /** @enum {string} */
            status: "queued" | "running" | "done" | "error";
            version: number;
        };
        RunRef: {
            /** Format: uuid */
            id: string;
            /** @enum {string} */
            status: "queued" | "running" | "done" | "error";
        };
        SearchResult: {
            estimatedTotal: number;
            /** @description Counts per value of category, badge, tags, team and approved over all matches */
            facets: {
                [key: string]: {
                    [key: string]: number;
                };
            };
            items: components["schemas"]["BlockSummary"][];
            nextCursor: string | null;
        };
        VersionList: {
            items: {
                approved: boolean;
                author: string;
                badge: components["schemas"]["Badge"];
                /** Format: date-time */
                createdAt: string;
                message: string;
                version: number;
            }[];
            nextCursor: string | null;
        };
    };
    responses: never;
    parameters: never;
    requestBodies: never;
    headers: never;
    pathItems: never;
}
export type $defs = Record<string, never>;
export interface operations {
    searchBlocks: {
        parameters: {
            query?: {
                approved?: "true" | "false";
                /** @description State of one version's checks */
                badge?: components["schemas"]["Badge"];
                category?: "oscillator" | "limiter" | "filter" | "amplifier" | "reference" | "power" | "interface" | "other";
                /** @description Opaque cursor from a previous page's nextCursor */
                cursor?: string;
                /** @description Page size (1–100) */
                limit?: number;
                q?: string;
                sort?: "relevance" | "updated" | "title";
                tag?: string;
                /** @description Team slug */
                team?: string;
            };
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description One page of results */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["SearchResult"];
                };
            };
            /** @description Sign-in or a valid token is required (or the token is malformed, revoked or expired) */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The request did not validate; `errors` lists the issues */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    createBlock: {
        parameters: {
            query?: {
                /** @description Team that owns the block (default: a token's own team, or the caller's only team) */
                team?: string;
                visibility?: "team" | "public";
            };
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "multipart/form-data": {
                    file: string;
                };
                "text/markdown": string;
            };
        };
        responses: {
            /** @description Created; the first check run is queued */
            201: {
                headers: {
                    /** @description URL of the new version */
                    Location: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Created"];
                };
            };
            /** @description Sign-in or a valid token is required (or the token is malformed, revoked or expired) */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The caller's role or token scope does not allow this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description No such resource, or a team block outside the caller's teams */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Conflict; on a stale base the body carries the current `head` */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The body is larger than allowed */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Unsupported Content-Type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The request did not validate; `errors` lists the issues */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    getBlock: {
        parameters: {
            query?: {
                /** @description json (default), md = the block file, spice = a runnable deck */
                format?: "json" | "md" | "spice";
            };
            header?: never;
            path: {
                /** @description Block slug, unique across the instance */
                slug: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The block: JSON, or with ?format=md the block file, with ?format=spice a runnable deck */
            200: {
                headers: {
                    "Cache-Control": string;
                    /** @description Strong validator: changes whenever the body would */
                    ETag: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Block"];
                    "text/markdown": string;
                    "text/plain": string;
                };
            };
            /** @description Not modified */
            304: {
                headers: {
                    "Cache-Control": string;
                    /** @description Strong validator: changes whenever the body would */
                    ETag: string;
                    [name: string]: unknown;
                };
                content?: never;
            };
            /** @description Sign-in or a valid token is required (or the token is malformed, revoked or expired) */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description No such resource, or a team block outside the caller's teams */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The request did not validate; `errors` lists the issues */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    getBadge: {
        parameters: {
            query?: {
                /** @description Version number, counted from 1 */
                version?: number;
            };
            header?: never;
            path: {
                /** @description Block slug, unique across the instance */
                slug: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description SVG image, Cache-Control max-age=60 */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "image/svg+xml": string;
                };
            };
            /** @description No such resource, or a team block outside the caller's teams */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The request did not validate; `errors` lists the issues */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    evaluateBlock: {
        parameters: {
            query?: {
                /** @description Run the simulations (default true for a file: CI wants the simulated quantities) */
                simulate?: "true" | "false";
            };
            header?: never;
            path: {
                /** @description Block slug, unique across the instance */
                slug: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": {
                    /**
                     * @description New parameter values by name
                     * @default {}
                     * @example {
                     *       "R": "3.9 kohm",
                     *       "C": "22 nF"
                     *     }
                     */
                    params?: {
                        [key: string]: string;
                    };
                    /** @description Run the simulations too; without it simulated checks are skipped */
                    simulate?: boolean;
                    /**
                     * @description Evaluate this stored version instead of the head
                     * @example 3
                     */
                    version?: number;
                };
                "multipart/form-data": {
                    file: string;
                };
                "text/markdown": string;
            };
        };
        responses: {
            /** @description The report */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Report"] & unknown;
                };
            };
            /** @description Sign-in or a valid token is required (or the token is malformed, revoked or expired) */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The caller's role or token scope does not allow this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description No such resource, or a team block outside the caller's teams */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The body is larger than allowed */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Unsupported Content-Type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The request did not validate; `errors` lists the issues */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Too many engine runs for this caller (signed out: for this block, or for everyone signed out); wait `Retry-After` seconds (`retryAfter` in the body) */
            429: {
                headers: {
                    /** @description Seconds until the budget allows this call again (RFC 9110 §10.2.3) */
                    "Retry-After": string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    forkBlock: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Block slug, unique across the instance */
                slug: string;
            };
            cookie?: never;
        };
        requestBody?: {
            content: {
                "application/json": {
                    /**
                     * @description Version to fork (default: the head)
                     * @example 3
                     */
                    fromVersion?: number;
                    /** @description Why the fork was made (default: where it came from) */
                    message?: string;
                    /**
                     * @description New parameter values by name
                     * @example {
                     *       "R": "3.9 kohm",
                     *       "C": "22 nF"
                     *     }
                     */
                    params?: {
                        [key: string]: string;
                    };
                    /**
                     * @description Slug of the new block (default: derived from the parent's)
                     * @example rc-lowpass-antialias
                     */
                    slug?: string;
                    /**
                     * @description Team that owns the fork (default: the caller's team)
                     * @example fenwick
                     */
                    team?: string;
                    title?: string;
                };
            };
        };
        responses: {
            /** @description Created; the first check run is queued */
            201: {
                headers: {
                    /** @description URL of the new version */
                    Location: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Created"];
                };
            };
            /** @description Sign-in or a valid token is required (or the token is malformed, revoked or expired) */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The caller's role or token scope does not allow this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description No such resource, or a team block outside the caller's teams */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Conflict; on a stale base the body carries the current `head` */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The body is larger than allowed */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Unsupported Content-Type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The request did not validate; `errors` lists the issues */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    retuneBlock: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Block slug, unique across the instance */
                slug: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": {
                    /**
                     * @description Parameter to solve for
                     * @example R
                     */
                    param: string;
                    /**
                     * @description Draft values of the other parameters to solve from (default: the head's)
                     * @example {
                     *       "R": "3.9 kohm",
                     *       "C": "22 nF"
                     *     }
                     */
                    params?: {
                        [key: string]: string;
                    };
                    /**
                     * @description IEC 60063 series to snap the result to
                     * @enum {string}
                     */
                    series: "E3" | "E6" | "E12" | "E24" | "E48" | "E96" | "E192";
                    target: {
                        /**
                         * @description Reported quantity to hit
                         * @example fc
                         */
                        quantity: string;
                        /**
                         * @description Target value with its unit
                         * @example 1 kHz
                         */
                        value: string;
                    };
                };
            };
        };
        responses: {
            /** @description Solved and snapped values with the report at the snapped value */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["RetuneResult"];
                };
            };
            /** @description Sign-in or a valid token is required (or the token is malformed, revoked or expired) */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The caller's role or token scope does not allow this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description No such resource, or a team block outside the caller's teams */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The body is larger than allowed */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Unsupported Content-Type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The request did not validate; `errors` lists the issues */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Too many engine runs for this caller (signed out: for this block, or for everyone signed out); wait `Retry-After` seconds (`retryAfter` in the body) */
            429: {
                headers: {
                    /** @description Seconds until the budget allows this call again (RFC 9110 §10.2.3) */
                    "Retry-After": string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    listVersions: {
        parameters: {
            query?: {
                /** @description Opaque cursor from a previous page's nextCursor */
                cursor?: string;
                /** @description Page size (1–100) */
                limit?: number;
            };
            header?: never;
            path: {
                /** @description Block slug, unique across the instance */
                slug: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description One page of versions */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["VersionList"];
                };
            };
            /** @description Sign-in or a valid token is required (or the token is malformed, revoked or expired) */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description No such resource, or a team block outside the caller's teams */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The request did not validate; `errors` lists the issues */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    addVersion: {
        parameters: {
            query?: {
                /** @description Version number, counted from 1 */
                baseVersion?: number;
                message?: string;
            };
            header?: never;
            path: {
                /** @description Block slug, unique across the instance */
                slug: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "application/json": {
                    /**
                     * @description The head version the change was made against
                     * @example 3
                     */
                    baseVersion: number;
                    /** @description What changed and why */
                    message?: string;
                    /**
                     * @description New parameter values by name
                     * @example {
                     *       "R": "3.9 kohm",
                     *       "C": "22 nF"
                     *     }
                     */
                    params: {
                        [key: string]: string;
                    };
                };
                "multipart/form-data": {
                    file: string;
                };
                "text/markdown": string;
            };
        };
        responses: {
            /** @description Created; the first check run is queued */
            201: {
                headers: {
                    /** @description URL of the new version */
                    Location: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Created"];
                };
            };
            /** @description Sign-in or a valid token is required (or the token is malformed, revoked or expired) */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The caller's role or token scope does not allow this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description No such resource, or a team block outside the caller's teams */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Conflict; on a stale base the body carries the current `head` */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The body is larger than allowed */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Unsupported Content-Type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The request did not validate; `errors` lists the issues */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    getVersion: {
        parameters: {
            query?: {
                /** @description json (default), md = the block file, spice = a runnable deck */
                format?: "json" | "md" | "spice";
            };
            header?: never;
            path: {
                /** @description Version number, counted from 1 */
                n: number;
                /** @description Block slug, unique across the instance */
                slug: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The block: JSON, or with ?format=md the block file, with ?format=spice a runnable deck */
            200: {
                headers: {
                    "Cache-Control": string;
                    /** @description Strong validator: changes whenever the body would */
                    ETag: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Block"];
                    "text/markdown": string;
                    "text/plain": string;
                };
            };
            /** @description Not modified */
            304: {
                headers: {
                    "Cache-Control": string;
                    /** @description Strong validator: changes whenever the body would */
                    ETag: string;
                    [name: string]: unknown;
                };
                content?: never;
            };
            /** @description Sign-in or a valid token is required (or the token is malformed, revoked or expired) */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description No such resource, or a team block outside the caller's teams */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The request did not validate; `errors` lists the issues */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    evaluateFile: {
        parameters: {
            query?: {
                /** @description Run the simulations (default true for a file: CI wants the simulated quantities) */
                simulate?: "true" | "false";
                /** @description Team whose engine budget and models apply (default: a token's own team, or the caller's only team) */
                team?: string;
            };
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody: {
            content: {
                "multipart/form-data": {
                    file: string;
                };
                "text/markdown": string;
            };
        };
        responses: {
            /** @description The report */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Report"] & unknown;
                };
            };
            /** @description Sign-in or a valid token is required (or the token is malformed, revoked or expired) */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description No such resource, or a team block outside the caller's teams */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The body is larger than allowed */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Unsupported Content-Type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The request did not validate; `errors` lists the issues */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Too many engine runs for this caller (signed out: for this block, or for everyone signed out); wait `Retry-After` seconds (`retryAfter` in the body) */
            429: {
                headers: {
                    /** @description Seconds until the budget allows this call again (RFC 9110 §10.2.3) */
                    "Retry-After": string;
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    getHealth: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Each part ok or a reason */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        db: string;
                        indexBacklog: number;
                        /** @description Under npm start: each part it runs, ok or why it is down and when it restarts */
                        parts?: {
                            [key: string]: string;
                        };
                        search: string;
                        worker: string;
                    };
                };
            };
            /** @description The database is down */
            503: {
                headers: {
                    [name: string]: unknown;
                };
                content?: never;
            };
        };
    };
    listModels: {
        parameters: {
            query?: {
                /** @description Team slug, or `shared` for the shared model library */
                team?: string;
            };
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description Each file's newest version */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": {
                        items: components["schemas"]["ModelSummary"][];
                    };
                };
            };
            /** @description Sign-in or a valid token is required (or the token is malformed, revoked or expired) */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description No such resource, or a team block outside the caller's teams */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The request did not validate; `errors` lists the issues */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    uploadModel: {
        parameters: {
            query?: {
                /** @description What changed */
                message?: string;
                /** @description File name when the body is text/plain (multipart takes the file's own name) */
                name?: string;
            };
            header?: never;
            path: {
                /** @description Team slug, or `shared` for the shared model library */
                team: string;
            };
            cookie?: never;
        };
        requestBody: {
            content: {
                "multipart/form-data": {
                    /**
                     * Format: binary
                     * @description The model file, named by its file name
                     */
                    file: string;
                };
                "text/plain": string;
            };
        };
        responses: {
            /** @description The new version */
            201: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["ModelUpload"];
                };
            };
            /** @description Sign-in or a valid token is required (or the token is malformed, revoked or expired) */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The caller's role or token scope does not allow this */
            403: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description No such resource, or a team block outside the caller's teams */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Conflict; on a stale base the body carries the current `head` */
            409: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The body is larger than allowed */
            413: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description Unsupported Content-Type */
            415: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The request did not validate; `errors` lists the issues */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    getModel: {
        parameters: {
            query?: {
                /** @description Version number, counted from 1 */
                version?: number;
            };
            header?: never;
            path: {
                /** @description Model file name as `.include` uses it */
                name: string;
                /** @description Team slug, or `shared` for the shared model library */
                team: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The file (head), or one version */
            200: {
                headers: {
                    "Cache-Control": string;
                    /** @description Strong validator: changes whenever the body would */
                    ETag: string;
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["ModelFile"] | components["schemas"]["ModelVersion"];
                };
            };
            /** @description If-None-Match matched the ETag */
            304: {
                headers: {
                    [name: string]: unknown;
                };
                content?: never;
            };
            /** @description Sign-in or a valid token is required (or the token is malformed, revoked or expired) */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description No such resource, or a team block outside the caller's teams */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description The request did not validate; `errors` lists the issues */
            422: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
    getOpenApi: {
        parameters: {
            query?: never;
            header?: never;
            path?: never;
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description OpenAPI 3.1 */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": Record<string, never>;
                };
            };
        };
    };
    getRun: {
        parameters: {
            query?: never;
            header?: never;
            path: {
                /** @description Check run id */
                id: string;
            };
            cookie?: never;
        };
        requestBody?: never;
        responses: {
            /** @description The run */
            200: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/json": components["schemas"]["Run"];
                };
            };
            /** @description Sign-in or a valid token is required (or the token is malformed, revoked or expired) */
            401: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
            /** @description No such resource, or a team block outside the caller's teams */
            404: {
                headers: {
                    [name: string]: unknown;
                };
                content: {
                    "application/problem+json": components["schemas"]["Problem"];
                };
            };
        };
    };
}
