export { groupSizes, meetingLowerBound, MIN_GROUP } from "./groups";
export { meetingMatrix, meetingStats, type Draw, type MeetingStats } from "./meetings";
export { randomDraw, shuffle } from "./random-draw";
export { makeDraw, type DrawInput, type DrawResult } from "./draw";
