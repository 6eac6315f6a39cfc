import Link from "next/link";

/** The one not-found page of the library: a team block outside your teams answers the same as no block. */
export function NotInLibrary() {
  return (
    <div className="mx-auto max-w-prose py-16 text-center">
      <h1 className="font-serif text-2xl font-semibold">Not in the library</h1>
      <p className="mt-2 text-graphite">There is no such page, or the block belongs to a team you are not in.</p>
      <Link href="/" className="mt-4 inline-block text-copper-dark underline">Back to the library</Link>
    </div>
  );
}
