// Package chart draws Saltcast's charts as self-contained SVG text.
//
// A Chart is plain data: lines (Series), shaded zones (Band) and labelled
// points (Marker) in the units the reader sees, with axis names and units.
// Render lays it out in a viewBox 768 units wide that scales to the width of
// its container (width="100%"), so at 768 px on a tablet the tick labels are
// 16 px and the data lines 3 px; printed on A4 or Letter they stay above
// 10 pt. Nothing in the SVG refers to an id, a font file or a URL, so several
// charts can sit in one page, and the same string works in the live app, on
// the printed batch sheet and as a file of its own.
//
// Colour is never the only cue: each solubility curve has its own dash
// pattern, each marker its own shape, the batch path is heavy and black with
// an arrowhead, and the metastable band has a dotted far edge, so a chart
// printed in black and white reads the same as on screen.
//
// Numbers are checked before anything is drawn: a NaN or an infinity
// anywhere in the data gives a *DataError naming the series and the point,
// and a chart with nothing to draw gives ErrNoData. Placeholder turns any
// such error into an SVG message the page can show instead.
//
// Every piece of text (titles, labels, compound names typed by a user) is
// XML-escaped; characters XML cannot hold are replaced by U+FFFD.
//
// The SVG holds two layers, <g data-layer="static"> (title, grid, axes,
// bands and curves) and <g data-layer="batch"> (paths, markers, legend and
// notes). A Renderer draws charts one after another and reuses the static
// layer's text while what it is drawn from (axes, curves, bands, title) is
// unchanged, and says so, so that a page can replace only the batch layer,
// the viewBox's height and the description; a SolubilityCache likewise keeps
// the converted curves while only the batch moves. Either way the result is
// byte for byte what Render gives for the same chart (tested).
//
// Solubility and Oxygen build the two charts Saltcast shows from plain
// values in °C and g per 100 g water (or mg/L): the solid phases' curves,
// the metastable band, the batch's path and its points, or the oxygen
// saturation curve with the day's and a measured point. They convert to the
// reader's temperature unit (TempUnit) and concentration unit (ConcUnit).
//
// Phases, BatchFromPlan, PlanView and CompoundView read the same values
// from compound.Compound and balance.Result; OxygenChartView computes the
// curve with gas.OxygenSaturation. SolubilitySVG and OxygenSVG go all the
// way to an SVG string and never fail: whatever cannot be drawn becomes a
// Placeholder that says why.
//
// Besides those core packages the package imports only cmp, errors, math,
// slices, sort, strconv, strings and unicode/utf8 (no fmt, no reflection), so
// it adds little to the WebAssembly build. Rendering a two-phase chart with
// its batch takes about 0.1 ms natively and 0.3 ms under WebAssembly; a
// redraw where only the batch moved a third to a half of that, with about
// half the allocations (see the benchmarks).
package chart
