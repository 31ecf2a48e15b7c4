export default function Page() { return <main>infra check</main>; }
