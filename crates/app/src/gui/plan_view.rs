//! The plan view: the wall outline seen from above with its wall numbers
//! and lengths, and the solved ridges, hips and valleys. Corners are
//! dragged to move them, a double-click on a wall adds a corner there.

use std::sync::{Arc, Mutex};

use egui::{Color32, Pos2, Rect, Sense, Stroke, Vec2};
use glam::DVec2;
use pitchframe_geometry::{Length, Plan, RoofLineKind};

use super::command::Command;
use super::derived::Derived;
use super::edit::{PlanEdit, corner_in, locate, neighbours, ring, wall_count, wall_ends_in};
use super::palette;
use super::snap::Snap;
use super::units::DisplayUnits;
use super::viewport::{PixelGrid, Renderer, fill_by_clearing};

/// Room left round the drawing, in points, for the lengths written
/// outside the walls.
const MARGIN_PT: f32 = 64.0;
/// How near the pointer must come to a wall or corner to reach it, in
/// points: about a fingertip on a touch pad.
const REACH_PT: f32 = 14.0;
/// The corner handles' size, in points: big enough to grab in gloves.
const HANDLE_PT: f32 = 24.0;
/// The text size of wall numbers and lengths.
const LABEL_SIZE: f32 = 16.0;
/// The red walls at fault are drawn in.
const FAULT: Color32 = Color32::from_rgb(220, 30, 30);

/// Which grid the corners snap to.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum GridStep {
    /// No grid: corners go where the pointer is.
    Off,
    /// 1 in, or 10 mm.
    #[default]
    Fine,
    /// 1 ft, or 100 mm.
    Coarse,
}

/// The plan view's own settings and the drag under way.
#[derive(Debug, Clone)]
pub struct PlanViewState {
    /// The grid corners snap to.
    pub grid: GridStep,
    /// Whether walls snap square (or to 45 degrees) to their neighbours.
    pub square: bool,
    /// The drawing's scale and place, held still while a corner is dragged
    /// so the plan does not slide under the pointer.
    frozen: Option<PlanTransform>,
    /// The wall whose corner is being dragged, and the drag's undo group.
    drag: Option<(usize, u64)>,
    /// The next drag's undo group.
    next_group: u64,
    /// Zoom over the fitted drawing (1 shows the whole plan).
    zoom: f64,
    /// How far the drawing has been dragged from its fitted place, in points.
    pan_pt: Vec2,
}

impl Default for PlanViewState {
    /// On the 1 in (10 mm) grid and square to the neighbours: most walls
    /// are laid out square.
    fn default() -> Self {
        Self {
            grid: GridStep::Fine,
            square: true,
            frozen: None,
            drag: None,
            next_group: 0,
            zoom: 1.0,
            pan_pt: Vec2::ZERO,
        }
    }
}

/// Closest and farthest zoom: a tenth of the fitted drawing to fifty times it.
const ZOOM_RANGE: std::ops::RangeInclusive<f64> = 0.1..=50.0;

impl PlanViewState {
    /// The snapping in force, for display units `units`.
    pub fn snap(&self, units: DisplayUnits) -> Snap {
        let [fine, coarse] = units.snap_steps_in();
        let grid_in = match self.grid {
            GridStep::Off => None,
            GridStep::Fine => Some(fine),
            GridStep::Coarse => Some(coarse),
        };
        Snap { grid_in, directions: self.square }
    }
}

/// Plan inches to screen points: Y up on the plan, down on the screen.
#[derive(Debug, Clone, Copy, PartialEq)]
struct PlanTransform {
    centre_in: DVec2,
    points_per_in: f64,
    screen_centre: Pos2,
}

impl PlanTransform {
    /// The transform fitting `min..max` (inches) into `rect`.
    fn fit(min: DVec2, max: DVec2, rect: Rect) -> Self {
        let size = (max - min).max(DVec2::splat(1.0));
        let room = rect.shrink(MARGIN_PT).size().max(Vec2::splat(10.0));
        let points_per_in = (f64::from(room.x) / size.x).min(f64::from(room.y) / size.y);
        Self { centre_in: (min + max) / 2.0, points_per_in, screen_centre: rect.center() }
    }

    /// The same drawing zoomed by `zoom` about the middle and moved by `pan_pt`.
    fn zoomed(self, zoom: f64, pan_pt: Vec2) -> Self {
        Self { points_per_in: self.points_per_in * zoom, screen_centre: self.screen_centre + pan_pt, ..self }
    }

    fn to_screen(self, p: DVec2) -> Pos2 {
        let d = (p - self.centre_in) * self.points_per_in;
        self.screen_centre + Vec2::new(d.x as f32, -d.y as f32)
    }

    fn to_plan(self, p: Pos2) -> DVec2 {
        let d = p - self.screen_centre;
        self.centre_in + DVec2::new(f64::from(d.x), -f64::from(d.y)) / self.points_per_in
    }
}

/// What the plan view shows besides the plan itself.
pub struct PlanViewInput<'a> {
    /// The plan being edited.
    pub plan: &'a Plan,
    /// What was worked out from it.
    pub derived: &'a Derived,
    /// How lengths are shown.
    pub units: DisplayUnits,
    /// The selected wall.
    pub selected_wall: Option<usize>,
    /// The selected corner (the wall starting there).
    pub selected_corner: Option<usize>,
    /// The 3D view's renderer, when there is a GL context: the background
    /// is then filled by clearing (see [`fill_by_clearing`]).
    pub renderer: Option<&'a Arc<Mutex<Renderer>>>,
}

/// The name of the corner wall `wall` starts at, as people count it.
pub fn corner_name(plan: &Plan, wall: usize) -> String {
    match locate(plan, wall) {
        Some((None, index)) => format!("Corner {}", index + 1),
        Some((Some(courtyard), index)) => format!("Courtyard {} corner {}", courtyard + 1, index + 1),
        None => format!("Corner {}", wall + 1),
    }
}

/// Shows the plan view filling `ui`.
pub fn plan_view_ui(
    ui: &mut egui::Ui,
    input: &PlanViewInput<'_>,
    state: &mut PlanViewState,
    commands: &mut Vec<Command>,
) {
    header_ui(ui, input, state, commands);
    let (rect, background) = ui.allocate_exact_size(ui.available_size(), Sense::click_and_drag());
    if state.zoom <= 0.0 {
        state.zoom = 1.0;
    }
    zoom_and_pan(ui, &background, state);
    let painter = ui.painter_at(rect);
    let plan = input.plan;
    let transform = state.frozen.unwrap_or_else(|| {
        let (min, max) = drawing_bounds(input);
        PlanTransform::fit(min, max, rect).zoomed(state.zoom, state.pan_pt)
    });
    let grid = grid_lines(rect, transform, input.units, ui.visuals().dark_mode);
    // egui draws a line one point wide as one row of whole pixels at one
    // point to a pixel, so the renderer can draw the same pixels unblended.
    let pixel_grid = (ui.ctx().pixels_per_point() == 1.0).then(|| grid.pixels()).flatten();
    match (input.renderer, pixel_grid) {
        (Some(renderer), Some(pixel_grid)) => {
            fill_by_clearing(&painter, renderer, rect, ui.visuals().extreme_bg_color, pixel_grid);
        }
        (Some(renderer), None) => {
            fill_by_clearing(&painter, renderer, rect, ui.visuals().extreme_bg_color, PixelGrid::default());
            grid.draw(&painter, rect);
        }
        (None, _) => {
            painter.rect_filled(rect, 0.0, ui.visuals().extreme_bg_color);
            grid.draw(&painter, rect);
        }
    }
    roof_ui(&painter, input, transform);

    let faults = input.derived.problem.as_ref().map(|p| p.walls.clone()).unwrap_or_default();
    let text_colour = ui.visuals().strong_text_color();
    let wall_colour = if ui.visuals().dark_mode { Color32::from_gray(230) } else { Color32::from_gray(30) };
    // Labels already drawn: a label that would overlap one is left out.
    let mut placed: Vec<Rect> = Vec::new();
    for wall in 0..wall_count(plan) {
        let Some((a, b)) = wall_ends_in(plan, wall) else { continue };
        let (sa, sb) = (transform.to_screen(a), transform.to_screen(b));
        let gable = locate(plan, wall)
            .and_then(|(r, i)| ring(plan, r).and_then(|walls| walls.get(i)))
            .is_some_and(|w| w.gable);
        let colour = if faults.contains(&wall) { FAULT } else { wall_colour };
        let width = if input.selected_wall == Some(wall) { 6.0 } else { 3.0 };
        if input.selected_wall == Some(wall) {
            painter.line_segment([sa, sb], Stroke::new(12.0, palette::selection(ui.visuals().dark_mode)));
        }
        if gable {
            painter.extend(egui::Shape::dashed_line(&[sa, sb], Stroke::new(width, colour), 10.0, 5.0));
        } else {
            painter.line_segment([sa, sb], Stroke::new(width, colour));
        }
        // Number on the wall, length beside it on the side away from the
        // building; each left out where the wall is too short on screen to
        // carry it, so a large plan does not drown in labels.
        let screen_length = (sb - sa).length();
        let middle = sa + (sb - sa) / 2.0;
        let away = away_from_building(plan, wall, sa, sb);
        // "3 gable" where it fits, else just the number (the dashed line still marks a gable).
        let font = egui::FontId::proportional(LABEL_SIZE);
        let long = if gable { format!("{} gable", wall + 1) } else { format!("{}", wall + 1) };
        let mut badge = painter.layout_no_wrap(long, font.clone(), Color32::WHITE);
        if gable && screen_length < badge.size().x + 6.0 + HANDLE_PT {
            badge = painter.layout_no_wrap(format!("{}", wall + 1), font, Color32::WHITE);
        }
        let badge_rect = Rect::from_center_size(middle, badge.size() + Vec2::splat(6.0));
        let selected_or_fault = input.selected_wall == Some(wall) || faults.contains(&wall);
        let badge_fits = screen_length > badge_rect.width().max(badge_rect.height()) + HANDLE_PT;
        if (badge_fits && !placed.iter().any(|other| other.intersects(badge_rect))) || selected_or_fault {
            placed.push(badge_rect);
            let fill = if faults.contains(&wall) { FAULT } else { palette::WALL_BADGE };
            painter.rect_filled(badge_rect, 4.0, fill);
            painter.galley(badge_rect.min + Vec2::splat(3.0), badge, Color32::WHITE);
        }
        let length = input.units.format(Length::from_inches((b - a).length()));
        let galley = painter.layout_no_wrap(length, egui::FontId::proportional(LABEL_SIZE), text_colour);
        // Stand the text clear of the wall and its number, whichever way the wall runs.
        let half = galley.size() / 2.0;
        let along = (sb - sa).normalized();
        let extent_along = along.x.abs() * galley.size().x + along.y.abs() * galley.size().y;
        let clear = 16.0 + away.x.abs() * half.x + away.y.abs() * half.y;
        // Outside the building first; inside when another label is in the
        // way or the view's edge would cut it.
        let free =
            |label: &Rect| rect.contains_rect(*label) && !placed.iter().any(|other| other.intersects(*label));
        let outside = Rect::from_center_size(middle + away * clear, galley.size());
        let inside = Rect::from_center_size(middle - away * clear, galley.size());
        let (text_rect, room) = match (free(&outside), free(&inside)) {
            (true, _) => (outside, true),
            (false, true) => (inside, true),
            (false, false) => (outside, false),
        };
        if (screen_length > extent_along + 8.0 && room) || selected_or_fault {
            placed.push(text_rect);
            painter.galley(text_rect.min, galley, text_colour);
        }
    }

    corners_ui(ui, input, state, transform, commands);

    if let Some(problem) = &input.derived.problem {
        let text = format!("{} ({})", problem.message, input.derived.shown_instead());
        let galley = painter.layout(text, egui::FontId::proportional(LABEL_SIZE), FAULT, rect.width() - 16.0);
        painter.galley(rect.min + Vec2::new(8.0, 6.0), galley, FAULT);
    }

    let pointer = background.interact_pointer_pos();
    let near = pointer.and_then(|pos| nearest_wall(plan, transform, pos));
    if background.double_clicked() {
        if let (Some(wall), Some(pos)) = (near, pointer)
            && let Some(at_in) = insertion_point(plan, wall, transform.to_plan(pos), input.units, state)
        {
            commands.push(Command::Edit { edit: PlanEdit::InsertCorner { wall, at_in }, group: None });
            commands.push(Command::SelectCorner(Some(wall + 1)));
        }
    } else if background.clicked() {
        commands.push(Command::SelectWall(near));
        commands.push(Command::SelectCorner(None));
    }
}

/// Scrolling zooms about the pointer; dragging the background moves the drawing.
fn zoom_and_pan(ui: &egui::Ui, background: &egui::Response, state: &mut PlanViewState) {
    if state.drag.is_some() {
        return;
    }
    if background.dragged() {
        state.pan_pt += background.drag_delta();
    }
    let scroll = if background.hovered() { ui.input(|input| input.smooth_scroll_delta.y) } else { 0.0 };
    if let (true, Some(pointer)) = (scroll != 0.0, background.hover_pos()) {
        let zoom =
            (state.zoom * (f64::from(scroll) * 0.002).exp()).clamp(*ZOOM_RANGE.start(), *ZOOM_RANGE.end());
        // Keep the plan point under the pointer where it is.
        let from_centre = pointer - background.rect.center() - state.pan_pt;
        state.pan_pt = pointer - background.rect.center() - from_centre * (zoom / state.zoom) as f32;
        state.zoom = zoom;
    }
}

/// The snap choices and the corner buttons above the drawing.
fn header_ui(
    ui: &mut egui::Ui,
    input: &PlanViewInput<'_>,
    state: &mut PlanViewState,
    commands: &mut Vec<Command>,
) {
    ui.horizontal_wrapped(|ui| {
        ui.label("Snap:");
        let [fine, coarse] = input.units.snap_step_labels();
        for (step, label) in [(GridStep::Off, "Off"), (GridStep::Fine, fine), (GridStep::Coarse, coarse)] {
            if ui.selectable_label(state.grid == step, label).clicked() {
                state.grid = step;
            }
        }
        ui.checkbox(&mut state.square, "Square and 45°")
            .on_hover_text("Walls snap to 0, 45 and 90 degrees from the neighbouring corners");
        if ui.button("Fit").on_hover_text("Show the whole plan (scroll to zoom, drag to move)").clicked() {
            state.zoom = 1.0;
            state.pan_pt = Vec2::ZERO;
        }
        ui.separator();
        let delete = ui.add_enabled(input.selected_corner.is_some(), egui::Button::new("Delete corner"));
        if delete.on_hover_text("Key: Delete").clicked() {
            commands.push(Command::DeleteSelectedCorner);
        }
        ui.label(
            egui::RichText::new("Drag a corner to move it; double-click a wall to add one; scroll to zoom.")
                .weak(),
        );
    });
}

/// The corner handles: drawn, clicked and dragged.
fn corners_ui(
    ui: &mut egui::Ui,
    input: &PlanViewInput<'_>,
    state: &mut PlanViewState,
    transform: PlanTransform,
    commands: &mut Vec<Command>,
) {
    let plan = input.plan;
    let dark = ui.visuals().dark_mode;
    // Corners closer than a handle on screen are drawn small.
    let shortest_pt = (0..wall_count(plan))
        .filter_map(|wall| wall_ends_in(plan, wall))
        .map(|(a, b)| (transform.to_screen(b) - transform.to_screen(a)).length())
        .fold(f32::INFINITY, f32::min);
    let corner_radius = if shortest_pt < HANDLE_PT { 3.5 } else { 6.0 };
    for wall in 0..wall_count(plan) {
        let Some((at, _)) = wall_ends_in(plan, wall) else { continue };
        let centre = transform.to_screen(at);
        let id = ui.scope_id().with(("corner", wall));
        let response =
            ui.interact(Rect::from_center_size(centre, Vec2::splat(HANDLE_PT)), id, Sense::click_and_drag());
        let name = corner_name(plan, wall);
        response.widget_info(|| egui::WidgetInfo::labeled(egui::Role::Button, true, &name));
        let selected = input.selected_corner == Some(wall);
        let radius = if selected || response.hovered() || response.dragged() { 9.0 } else { corner_radius };
        if selected {
            ui.painter().circle_filled(centre, radius + 4.0, palette::selection(dark));
        }
        let fill = if dark { Color32::from_gray(240) } else { Color32::from_gray(20) };
        ui.painter().circle_filled(centre, radius, fill);
        let response = response.on_hover_text(format!("{name}: drag to move, click to select"));
        if response.drag_started() {
            state.next_group += 1;
            state.drag = Some((wall, state.next_group));
            state.frozen = Some(transform);
            commands.push(Command::SelectCorner(Some(wall)));
        }
        if let (true, Some((dragged, group)), Some(pos)) =
            (response.dragged(), state.drag, response.interact_pointer_pos())
            && dragged == wall
        {
            let to_in = dragged_to(plan, wall, transform.to_plan(pos), state.snap(input.units));
            if (to_in - at).length_squared() > 0.0 {
                commands
                    .push(Command::Edit { edit: PlanEdit::MoveCorner { wall, to_in }, group: Some(group) });
            }
        }
        if response.drag_stopped() {
            state.drag = None;
            state.frozen = None;
        }
        if response.clicked() {
            commands.push(Command::SelectCorner(Some(wall)));
            commands.push(Command::SelectWall(Some(wall)));
        }
    }
}

/// Where a corner dragged to `pointer_in` lands after snapping.
pub fn dragged_to(plan: &Plan, wall: usize, pointer_in: DVec2, snap: Snap) -> DVec2 {
    let Some((before, after)) = neighbours(plan, wall) else { return pointer_in };
    let corner = |w: usize| {
        locate(plan, w).and_then(|(r, i)| ring(plan, r).and_then(|walls| walls.get(i))).map(corner_in)
    };
    match (corner(before), corner(after)) {
        (Some(a), Some(b)) => snap.corner(pointer_in, [a, b]),
        _ => pointer_in,
    }
}

/// Where a double-click at `pointer_in` puts a new corner on `wall`: on
/// the wall line, its distance from the wall's start on the grid.
fn insertion_point(
    plan: &Plan,
    wall: usize,
    pointer_in: DVec2,
    units: DisplayUnits,
    state: &PlanViewState,
) -> Option<DVec2> {
    let (a, b) = wall_ends_in(plan, wall)?;
    let length = (b - a).length();
    let along = (b - a).try_normalize()?;
    let mut distance = (pointer_in - a).dot(along);
    if let Some(step) = state.snap(units).grid_in {
        distance = (distance / step).round() * step;
    }
    // A corner at either end would repeat it.
    (distance > 0.0 && distance < length).then(|| a + along * distance)
}

/// The wall nearest `pos` within reach.
fn nearest_wall(plan: &Plan, transform: PlanTransform, pos: Pos2) -> Option<usize> {
    (0..wall_count(plan))
        .filter_map(|wall| {
            let (a, b) = wall_ends_in(plan, wall)?;
            let distance = distance_to_segment(pos, transform.to_screen(a), transform.to_screen(b));
            (distance <= REACH_PT).then_some((wall, distance))
        })
        .min_by(|x, y| x.1.total_cmp(&y.1))
        .map(|(wall, _)| wall)
}

fn distance_to_segment(p: Pos2, a: Pos2, b: Pos2) -> f32 {
    let ab = b - a;
    let t = if ab.length_sq() > 0.0 { ((p - a).dot(ab) / ab.length_sq()).clamp(0.0, 1.0) } else { 0.0 };
    (p - (a + ab * t)).length()
}

/// The unit screen direction square to the wall, pointing away from the
/// building (out of the outer ring, into a courtyard).
fn away_from_building(plan: &Plan, wall: usize, a: Pos2, b: Pos2) -> Vec2 {
    let along = (b - a).normalized();
    // On screen Y points down, so (y, -x) is the left of the direction.
    let screen_left = Vec2::new(along.y, -along.x);
    let ring_ccw = locate(plan, wall).and_then(|(r, _)| ring(plan, r)).map(|walls| {
        let corners: Vec<DVec2> = walls.iter().map(corner_in).collect();
        let count = corners.len();
        (0..count).map(|i| corners[i].perp_dot(corners[(i + 1) % count])).sum::<f64>() > 0.0
    });
    let is_outer = locate(plan, wall).is_some_and(|(r, _)| r.is_none());
    // Counter-clockwise on the plan, the building lies on a wall's left;
    // the outer ring's outside is on the right, a courtyard's on the left.
    match (ring_ccw.unwrap_or(true), is_outer) {
        (true, true) | (false, false) => -screen_left,
        _ => screen_left,
    }
}

/// The box to fit: the corners and the eaves, in inches.
fn drawing_bounds(input: &PlanViewInput<'_>) -> (DVec2, DVec2) {
    let plan = input.plan;
    let corners = plan.walls.iter().chain(plan.courtyards.iter().flatten()).map(corner_in);
    let eaves = input
        .derived
        .roof_scene()
        .roof
        .iter()
        .flat_map(|roof| &roof.planes)
        .flat_map(|plane| plane.eave_outline.iter().map(|p| p.truncate()));
    let mut points = corners.chain(eaves);
    let Some(first) = points.next() else { return (DVec2::ZERO, DVec2::ONE) };
    points.fold((first, first), |(min, max), p| (min.min(p), max.max(p)))
}

/// A faint grid every foot (or 100 mm), or every ten when that is too
/// fine: where its lines fall on the screen.
struct GridLines {
    /// Screen x of each line running up the view, in points.
    xs: Vec<f32>,
    /// Screen y of each line running across it, in points.
    ys: Vec<f32>,
    colour: Color32,
}

fn grid_lines(rect: Rect, transform: PlanTransform, units: DisplayUnits, dark: bool) -> GridLines {
    let [_, coarse] = units.snap_steps_in();
    let mut step = coarse;
    while step * transform.points_per_in < 8.0 {
        step *= 10.0;
    }
    let colour = if dark { Color32::from_gray(50) } else { Color32::from_gray(215) };
    let (low, high) = (transform.to_plan(rect.left_bottom()), transform.to_plan(rect.right_top()));
    let mut xs = Vec::new();
    let mut x = (low.x / step).floor() * step;
    while x <= high.x {
        xs.push(transform.to_screen(DVec2::new(x, 0.0)).x);
        x += step;
    }
    let mut ys = Vec::new();
    let mut y = (low.y / step).floor() * step;
    while y <= high.y {
        ys.push(transform.to_screen(DVec2::new(0.0, y)).y);
        y += step;
    }
    GridLines { xs, ys, colour }
}

impl GridLines {
    fn draw(&self, painter: &egui::Painter, rect: Rect) {
        let stroke = Stroke::new(1.0, self.colour);
        for &sx in &self.xs {
            painter.line_segment([Pos2::new(sx, rect.top()), Pos2::new(sx, rect.bottom())], stroke);
        }
        for &sy in &self.ys {
            painter.line_segment([Pos2::new(rect.left(), sy), Pos2::new(rect.right(), sy)], stroke);
        }
    }

    /// The pixel columns and rows egui would fill for these lines at one
    /// pixel to a point (it puts a one-pixel line's centre on the nearest
    /// pixel centre); `None` where a position is not a number.
    fn pixels(&self) -> Option<PixelGrid> {
        let pixel = |at: f32| at.is_finite().then(|| (at - 0.5).round() as i32);
        Some(PixelGrid {
            columns: self.xs.iter().map(|&x| pixel(x)).collect::<Option<_>>()?,
            rows: self.ys.iter().map(|&y| pixel(y)).collect::<Option<_>>()?,
            colour: self.colour,
        })
    }
}

/// The roof seen from above: eave lines and the ridges, hips and valleys.
fn roof_ui(painter: &egui::Painter, input: &PlanViewInput<'_>, transform: PlanTransform) {
    let Some(roof) = &input.derived.roof_scene().roof else { return };
    // A roof from an earlier plan is drawn faint: it no longer matches.
    let alpha = if input.derived.stale() { 90 } else { 255 };
    let fade = |[r, g, b]: [u8; 3]| Color32::from_rgba_unmultiplied(r, g, b, alpha);
    let eave = fade(palette::part(super::scene::PartKind::RoofPlanes));
    for plane in &roof.planes {
        let points: Vec<Pos2> =
            plane.eave_outline.iter().map(|p| transform.to_screen(p.truncate())).collect();
        painter.add(egui::Shape::closed_line(points, Stroke::new(1.0, eave)));
    }
    for line in &roof.lines {
        let colour = fade(palette::part(super::scene::PartKind::RoofLines(line.kind)));
        let width = if line.kind == RoofLineKind::Ridge { 3.0 } else { 2.5 };
        painter.line_segment(
            [transform.to_screen(line.from.truncate()), transform.to_screen(line.to.truncate())],
            Stroke::new(width, colour),
        );
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn grid_pixels_are_those_egui_fills_for_a_one_pixel_line() {
        use egui::emath::GuiRounding as _;
        let positions = [100.0_f32, 100.3, 100.5, 100.7, 101.49, 0.2, 639.999];
        let grid = GridLines { xs: positions.to_vec(), ys: positions.to_vec(), colour: Color32::GRAY };
        let pixels = grid.pixels().unwrap();
        // Reference: egui's tessellator puts a one-pixel line's centre on
        // `round_to_pixel_center` at one pixel to a point; that pixel is
        // the one whose centre it is.
        for (&at, (&column, &row)) in positions.iter().zip(pixels.columns.iter().zip(&pixels.rows)) {
            let centre = at.round_to_pixel_center(1.0);
            assert_eq!(column as f32 + 0.5, centre, "x {at}");
            assert_eq!(row as f32 + 0.5, centre, "y {at}");
        }
        let bad = GridLines { xs: vec![f32::NAN], ys: Vec::new(), colour: Color32::GRAY };
        assert_eq!(bad.pixels(), None);
    }

    #[test]
    fn plan_points_go_to_the_screen_and_back_with_y_up() {
        let rect = Rect::from_min_size(Pos2::new(100.0, 50.0), Vec2::new(600.0, 400.0));
        let transform = PlanTransform::fit(DVec2::ZERO, DVec2::new(480.0, 240.0), rect);
        let low = transform.to_screen(DVec2::ZERO);
        let high = transform.to_screen(DVec2::new(480.0, 240.0));
        assert!(high.y < low.y, "plan +Y must point up the screen");
        assert!(rect.contains(low) && rect.contains(high));
        let back = transform.to_plan(transform.to_screen(DVec2::new(123.0, 45.0)));
        assert!((back - DVec2::new(123.0, 45.0)).length() < 1e-3);
    }

    #[test]
    fn zooming_about_a_point_keeps_it_under_the_pointer() {
        let rect = Rect::from_min_size(Pos2::new(100.0, 50.0), Vec2::new(600.0, 400.0));
        let fitted = PlanTransform::fit(DVec2::ZERO, DVec2::new(480.0, 240.0), rect);
        let point = DVec2::new(100.0, 50.0);
        let pointer = fitted.to_screen(point);
        // Derivation: doubling the scale about the pointer moves the centre
        // away from it by the pointer's offset from the centre.
        let pan = pointer - rect.center() - (pointer - rect.center()) * 2.0;
        let zoomed = fitted.zoomed(2.0, pan);
        assert!((zoomed.to_screen(point) - pointer).length() < 1e-3);
    }

    #[test]
    fn a_new_corner_lands_on_the_wall_a_round_distance_along_it() {
        let plan = pitchframe_geometry::demo_plan().unwrap();
        let state = PlanViewState::default();
        // Wall 1 runs from (0, 0) to (528, 0); a click a little off it at x = 100.4.
        let at = insertion_point(&plan, 0, DVec2::new(100.4, 3.0), DisplayUnits::FeetInches, &state).unwrap();
        // Derivation: projected onto the wall, 100.4 in along rounds to 100 on the 1 in grid.
        assert_eq!(at, DVec2::new(100.0, 0.0));
        assert_eq!(insertion_point(&plan, 0, DVec2::new(0.2, 0.0), DisplayUnits::FeetInches, &state), None);
    }
}
