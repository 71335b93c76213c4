export default function Page() {
  return <h1 className="page-title">Ask</h1>;
}
