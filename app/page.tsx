export default function HomePage() {
  return (
    <main className="mx-auto max-w-5xl p-8">
      <h1 className="font-serif text-3xl">Assay</h1>
      <p className="mt-2 text-graphite">A team library of verified circuit blocks.</p>
    </main>
  );
}
