import { Page } from '../components/Page';

/** The Maps area. Its feature fills the page body; the heading and the line stay. */
export function MapsRoute() {
  return (
    <Page
      title="Maps"
      description="The map library: your team's compressor and turbine maps, beside the built-in demo maps."
    />
  );
}
