/**
 * Pieces of a run's review, shared by the logbook and the field screen's end-of-window summary:
 *
 *   <TimelineStrip definition={task} flights={lane.flights} label="Ada" />          (LaneScore or LaneLive flights)
 *   <Breakdown definition={task} lane={laneScore} />                              (phoneResult(…).folded.lanes[i], lib/offline/run-result.ts)
 *   <FlightsTable flights={lane.flights} label="Ada" />
 *   <CorrectionsList events={runEvents} lanes={run.lanes} deviceId={deviceId} />
 */
export { TimelineStrip, describeStrip } from "./timeline-strip";
export { stripLayout, type StripLayout } from "./strip-layout";
export { Breakdown } from "./breakdown";
export { FlightsTable } from "./flights-table";
export { CorrectionsList } from "./corrections-list";
export { ClockNote } from "./clock-note";
export { Rulings } from "./rulings";
export { RulingNotes, describeRulingNote } from "./ruling-notes";
export { SetAsidePenalties } from "./set-aside-penalties";
