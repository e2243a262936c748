export default function Loading() {
  return <p className="text-stone-500">Loading…</p>;
}
