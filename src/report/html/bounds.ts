/**
 * How much of a plan the page draws one by one. Above CONTACT_DETAIL_LIMIT contacts the
 * station-day view draws each row's busy time (the union of its windows) and the contact
 * list shows per station-day totals and the TOP_CONTACTS highest-volume contacts, and says
 * so; contacts.csv and plan.json always hold every contact. With these bounds the page stays
 * under about 5 MB at any fleet size (the browser test checks a generated large fleet).
 */
export const CONTACT_DETAIL_LIMIT = 2000;
export const TOP_CONTACTS = 100;
/** Spacecraft charted in "Elevation and data rate" (the first in file order). */
export const SERIES_SPACECRAFT_LIMIT = 12;
/** Margin-check rows listed (failures first). */
export const MARGIN_ROWS_LIMIT = 300;
