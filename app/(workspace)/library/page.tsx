export default function LibraryPage() {
  return <h1 className="text-xl font-semibold">Correlation library</h1>;
}
