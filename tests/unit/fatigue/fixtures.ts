/** ASTM E1049-85 (reapproved 2017), rainflow counting example (5.4.4). */
export const ASTM_EXAMPLE = [-2, 1, -3, 5, -1, 3, -4, 4, -2];
