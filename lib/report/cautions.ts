/** What the report itself adds to the trade's cautions: how to read its fatigue figures and its period. */
export const REPORT_NOTES = [
  "Fatigue damage is an estimate that depends on the detail category chosen by the engineer, and assumes the gauge measures the nominal stress range at the detail.",
  "The period is made of whole days on the structure's clock, midnight to midnight in its time zone; a day with a clock change has 23 or 25 hours.",
];

/** The cautions every report carries, in the PDF and the JSON: what the figures assume and who decides. */
export const REPORT_CAUTIONS = [
  "Monitoring supplements inspection and never replaces it.",
  "Limits and their meaning are the responsibility of a licensed engineer under local codes; the product's defaults are examples only.",
  "Alerts can be delayed by logger, network or mail failures: a period with missing data is not an all clear for the hours without readings.",
  ...REPORT_NOTES,
];
