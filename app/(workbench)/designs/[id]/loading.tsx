export default function DesignLoading() {
  return <p className="text-ink-muted">Loading the design…</p>;
}
