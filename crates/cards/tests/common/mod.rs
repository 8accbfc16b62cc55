//! An invented hip roof and a few of its members, built by hand from the
//! published rafter-table method, for the printed-output tests.

// Test helpers may unwrap: a panic there is a failed test.
#![allow(clippy::unwrap_used, clippy::expect_used)]
#![allow(clippy::too_many_arguments)]
#![allow(dead_code)]

use glam::{DVec2, DVec3};
use pitchframe_cards::{
    CardCut, CardDeck, CutFace, CutMark, MemberCard, MemberLengths, MemberView, OrderPiece, OrderSettings,
    StockSeries, ViewFace, order_lumber,
};
use pitchframe_geometry::{
    AngleSetting, CompoundCut, LengthStyle, Pitch, RafterTable, Roof, RoofLine, RoofLineKind, RoofPlane,
};

/// A 44 ft x 28 ft hip roof at 6 in 12 with 16 in overhangs.
pub const LENGTH_IN: f64 = 528.0;
pub const WIDTH_IN: f64 = 336.0;
pub const OVERHANG_IN: f64 = 16.0;

pub fn rise_per_run() -> f64 {
    0.5
}

fn plane(wall: usize, corners: &[DVec2], rise: f64, ridge_height: f64, outward: &[DVec2]) -> RoofPlane {
    let _ = ridge_height;
    let outline: Vec<DVec3> = corners.iter().map(|c| c.extend(0.0)).collect();
    let eave_outline = corners
        .iter()
        .zip(outward)
        .map(|(c, o)| (*c + *o * OVERHANG_IN).extend(-OVERHANG_IN * rise))
        .collect();
    RoofPlane { wall, rise_per_run: rise, outline, eave_outline, plane_group: wall }
}

/// The roof's planes and lines, solved by hand: the ridge runs between the
/// points half the width in from each end, at half the width times the rise.
pub fn hip_roof() -> Roof {
    let r = rise_per_run();
    let half = WIDTH_IN / 2.0;
    let h = half * r;
    let (a, b, c, d) =
        (DVec2::ZERO, DVec2::new(LENGTH_IN, 0.0), DVec2::new(LENGTH_IN, WIDTH_IN), DVec2::new(0.0, WIDTH_IN));
    let (p, q) = (DVec2::new(half, half), DVec2::new(LENGTH_IN - half, half));
    let mut south = plane(
        0,
        &[a, b, q, p],
        r,
        h,
        &[DVec2::new(-1.0, -1.0), DVec2::new(1.0, -1.0), DVec2::ZERO, DVec2::ZERO],
    );
    south.outline[2].z = h;
    south.outline[3].z = h;
    let mut east = plane(1, &[b, c, q], r, h, &[DVec2::new(1.0, -1.0), DVec2::new(1.0, 1.0), DVec2::ZERO]);
    east.outline[2].z = h;
    let mut north = plane(
        2,
        &[c, d, p, q],
        r,
        h,
        &[DVec2::new(1.0, 1.0), DVec2::new(-1.0, 1.0), DVec2::ZERO, DVec2::ZERO],
    );
    north.outline[2].z = h;
    north.outline[3].z = h;
    let mut west = plane(3, &[d, a, p], r, h, &[DVec2::new(-1.0, 1.0), DVec2::new(-1.0, -1.0), DVec2::ZERO]);
    west.outline[2].z = h;
    let hip = |from: DVec2, to: DVec2, walls| RoofLine {
        kind: RoofLineKind::Hip,
        from: from.extend(0.0),
        to: to.extend(h),
        walls,
    };
    Roof {
        planes: vec![south, east, north, west],
        lines: vec![
            RoofLine { kind: RoofLineKind::Ridge, from: p.extend(h), to: q.extend(h), walls: [0, 2] },
            hip(a, p, [3, 0]),
            hip(b, q, [0, 1]),
            hip(c, q, [1, 2]),
            hip(d, p, [2, 3]),
        ],
        gables: vec![],
    }
}

/// The side view of a rafter with a plumb top cut, a birdsmouth and a
/// plumb tail, in the member's frame (x along the bottom edge, y square to
/// it), and the marks of its cuts. `seat_to_top` and `tail` are along the
/// top edge.
pub fn rafter_side_view(
    depth: f64,
    theta: f64,
    seat_to_top: f64,
    tail: f64,
    seat_width: f64,
) -> (MemberView, Vec<(CutFace, CutMark)>) {
    let (s, c) = theta.sin_cos();
    let down = DVec2::new(-s, -c); // plumb, downwards, in the member's frame
    let level_in = DVec2::new(c, -s); // level, towards the ridge
    let x_tail = 0.0_f64.max(depth * s / c);
    let x_heel = x_tail + tail;
    let x_top = x_heel + seat_to_top;
    let on_bottom = |x_top_edge: f64| DVec2::new(x_top_edge - depth * s / c, 0.0);
    let t = (depth - seat_width * s) / c;
    let heel_corner = DVec2::new(x_heel, depth) + down * t;
    let seat_end = heel_corner + level_in * seat_width;
    let outline = vec![
        on_bottom(x_tail),
        on_bottom(x_heel),
        heel_corner,
        seat_end,
        on_bottom(x_top),
        DVec2::new(x_top, depth),
        DVec2::new(x_tail, depth),
    ];
    let faces = vec![
        ViewFace { face: CutFace::TailPlumb, outline: vec![DVec2::new(x_tail, depth), on_bottom(x_tail)] },
        ViewFace { face: CutFace::Heel, outline: vec![on_bottom(x_heel), heel_corner] },
        ViewFace { face: CutFace::Seat, outline: vec![heel_corner, seat_end] },
        ViewFace { face: CutFace::TopPlumb, outline: vec![on_bottom(x_top), DVec2::new(x_top, depth)] },
    ];
    let along = DVec2::X;
    let marks = vec![
        (
            CutFace::TailPlumb,
            CutMark { edge_point: DVec2::new(x_tail, depth), into_board: down, edge_along: along },
        ),
        (
            CutFace::Heel,
            CutMark { edge_point: DVec2::new(x_heel, depth), into_board: down, edge_along: along },
        ),
        (
            CutFace::Seat,
            CutMark { edge_point: DVec2::new(x_heel, depth), into_board: level_in, edge_along: along },
        ),
        (
            CutFace::TopPlumb,
            CutMark { edge_point: DVec2::new(x_top, depth), into_board: down, edge_along: along },
        ),
    ];
    (MemberView { outline, faces, parts: vec![] }, marks)
}

fn plumb_settings(theta: f64, plan_angle: f64) -> Vec<AngleSetting> {
    CompoundCut::new(theta, plan_angle).map(|cut| cut.settings()).unwrap_or_default()
}

fn rafter(
    label: &str,
    kind: &str,
    count: u32,
    size: &str,
    depth: f64,
    theta: f64,
    seat_to_top: f64,
    tail: f64,
    places: Vec<[DVec2; 2]>,
    table: &RafterTable,
    hip: bool,
) -> MemberCard {
    let (side_view, marks) = rafter_side_view(depth, theta, seat_to_top, tail, 3.5);
    let (plumb, level) =
        if hip { (&table.hip_plumb, &table.hip_level) } else { (&table.common_plumb, &table.common_level) };
    let cut = |face: CutFace, place: &str| {
        let mark = marks.iter().find(|(f, _)| *f == face).map(|(_, m)| *m);
        let square = if face == CutFace::Seat { level.clone() } else { plumb.clone() };
        CardCut {
            face,
            place: place.into(),
            square: Some(square),
            settings: if face == CutFace::Seat {
                vec![]
            } else {
                plumb_settings(theta, 0.0).into_iter().take(1).collect()
            },
            angles: None,
            mark,
            top_mark: None,
            notes: if face == CutFace::Seat {
                vec![format!("notch depth {:.3} in square to the edge", 3.5 * theta.sin())]
            } else {
                vec![]
            },
        }
    };
    let overall = side_view.outline.iter().map(|p| p.x).fold(f64::MIN, f64::max)
        - side_view.outline.iter().map(|p| p.x).fold(f64::MAX, f64::min);
    MemberCard {
        label: label.into(),
        kind: kind.into(),
        count,
        size: size.into(),
        thickness_in: 1.5,
        depth_in: depth,
        pitch_rad: theta,
        lengths: MemberLengths {
            long_point_in: None,
            short_point_in: None,
            seat_to_top_cut_in: Some(seat_to_top),
            tail_in: Some(tail),
            overall_in: overall,
        },
        cuts: vec![
            cut(CutFace::TailPlumb, "lower end, at the fascia"),
            cut(CutFace::Heel, "birdsmouth, at the wall line"),
            cut(CutFace::Seat, "birdsmouth, on the plate"),
            cut(CutFace::TopPlumb, "upper end, against the ridge"),
        ],
        warnings: vec![],
        side_view,
        top_view: None,
        places,
    }
}

/// The sample deck: commons, a hip with a double cheek, and the lumber order.
pub fn sample_deck() -> CardDeck {
    let pitch = Pitch::parse("6/12").unwrap();
    let table = RafterTable::for_pitch(pitch);
    let theta = pitch.angle_rad();
    let half = WIDTH_IN / 2.0;
    // Common: run to the ridge centre less half the 1-1/2 in ridge
    // (trade.md section 6), times the length per unit run.
    let common_run = half - 0.75;
    let lc = pitch.length_per_run();
    let places: Vec<[DVec2; 2]> = (0..=8)
        .map(|i| 168.0 + 24.0 * f64::from(i))
        .flat_map(|x| {
            [[DVec2::new(x, 0.0), DVec2::new(x, half)], [DVec2::new(x, WIDTH_IN), DVec2::new(x, half)]]
        })
        .collect();
    let commons = rafter(
        "C1",
        "common rafter",
        places.len() as u32,
        "2x8",
        7.25,
        theta,
        common_run * lc,
        OVERHANG_IN * lc,
        places,
        &table,
        false,
    );

    let hip_theta = table.hip_pitch_deg.to_radians();
    let hip_per_run = 1.0 / hip_theta.cos();
    // Hip: plan run half * sqrt 2, less half the ridge's 45-degree thickness.
    let hip_run = half * std::f64::consts::SQRT_2 - 0.75 * std::f64::consts::SQRT_2;
    let hip_places = hip_roof()
        .lines
        .iter()
        .filter(|l| l.kind == RoofLineKind::Hip)
        .map(|l| [l.from.truncate(), l.to.truncate()])
        .collect();
    let mut hip = rafter(
        "H1",
        "hip",
        4,
        "2x10",
        9.25,
        hip_theta,
        hip_run * hip_per_run,
        OVERHANG_IN * std::f64::consts::SQRT_2 * hip_per_run,
        hip_places,
        &table,
        true,
    );
    let end = hip.side_view.outline.iter().map(|p| p.x).fold(f64::MIN, f64::max);
    let cheek_back = 0.75 * hip_per_run;
    hip.top_view = Some(MemberView {
        outline: vec![
            DVec2::new(0.0, 0.0),
            DVec2::new(end - cheek_back, 0.0),
            DVec2::new(end, 0.75),
            DVec2::new(end - cheek_back, 1.5),
            DVec2::new(0.0, 1.5),
        ],
        faces: vec![
            ViewFace {
                face: CutFace::Cheek,
                outline: vec![DVec2::new(end - cheek_back, 0.0), DVec2::new(end, 0.75)],
            },
            ViewFace {
                face: CutFace::Cheek,
                outline: vec![DVec2::new(end, 0.75), DVec2::new(end - cheek_back, 1.5)],
            },
            ViewFace {
                face: CutFace::Backing,
                outline: vec![
                    DVec2::new(0.0, 0.6),
                    DVec2::new(end - cheek_back * 0.6, 0.6),
                    DVec2::new(end - cheek_back * 0.6, 0.9),
                    DVec2::new(0.0, 0.9),
                ],
            },
        ],
        parts: vec![],
    });
    hip.lengths.long_point_in = hip.lengths.seat_to_top_cut_in;
    hip.lengths.short_point_in = hip.lengths.seat_to_top_cut_in.map(|l| l - cheek_back);
    hip.cuts.push(CardCut {
        face: CutFace::Cheek,
        place: "upper end, double cheek against the ridge".into(),
        square: Some(table.hip_side_cut.clone()),
        settings: plumb_settings(hip_theta, std::f64::consts::FRAC_PI_4),
        angles: None,
        mark: None,
        top_mark: None,
        notes: vec![],
    });
    hip.warnings.push("seat notch is 0.41 of the depth, deeper than the 1/3 limit set".into());

    let pieces: Vec<OrderPiece> = [&commons, &hip]
        .iter()
        .map(|m| OrderPiece {
            label: m.label.clone(),
            size: m.size.clone(),
            length_in: m.lengths.overall_in,
            count: m.count,
        })
        .collect();
    let lumber = order_lumber(&pieces, &OrderSettings::for_series(StockSeries::Feet)).ok();
    CardDeck {
        title: "Sample hip roof".into(),
        length_style: LengthStyle::FeetInches,
        outline: vec![vec![
            DVec2::ZERO,
            DVec2::new(LENGTH_IN, 0.0),
            DVec2::new(LENGTH_IN, WIDTH_IN),
            DVec2::new(0.0, WIDTH_IN),
        ]],
        roof: hip_roof(),
        members: vec![commons, hip],
        warnings: vec!["walls were drawn square; measure the diagonals before cutting".into()],
        lumber,
    }
}
