export default function Page() {
  return <h1 className="page-title">Notes</h1>;
}
