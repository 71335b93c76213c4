export default function Page() {
  return <h1 className="page-title">Answers</h1>;
}
