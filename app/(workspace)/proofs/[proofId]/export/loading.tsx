export default function Loading() {
  return <p className="text-stone-500" aria-busy="true">Loading exports…</p>;
}
