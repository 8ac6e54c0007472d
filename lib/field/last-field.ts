/**
 * The localStorage key of the field last set up on this phone (the set-up form suggests it; a plan item
 * starts its window there). Its own module, so /field's plans island does not load the set-up form and
 * build its schemas just to read one key (issue #10).
 */
export const LAST_FIELD_KEY = "windowcall.field.last-field";
