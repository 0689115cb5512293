import { Page } from '../components/Page';

/** The Learn area. Its feature fills the page body; the heading and the line stay. */
export function LearnRoute() {
  return (
    <Page
      title="Learn"
      description="Follow each number from the inputs to the point on the map: air density, mass flow, corrected flow, pressure ratio and outlet temperature, with formulas and sources."
    />
  );
}
