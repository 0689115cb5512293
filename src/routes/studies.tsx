import { Page } from '../components/Page';

/** The Studies area. Its feature fills the page body; the heading and the line stay. */
export function StudiesRoute() {
  return (
    <Page
      title="Studies"
      description="A study holds an engine, its fuel system, the scenarios and the plans being judged, and shows whether each plan keeps every operating line inside the compressor map with margin."
    />
  );
}
