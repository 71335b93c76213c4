export default function Page() {
  return <h1 className="page-title">Trees</h1>;
}
