/** Days an invitation link stays usable after it is sent (or sent again). Headroom's own choice. */
export const invitationValidDays = 7;
