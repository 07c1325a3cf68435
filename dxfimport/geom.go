package dxfimport

import "math"

// affine is a 2D affine map: x' = A*x + B*y + C, y' = D*x + E*y + F.
type affine struct{ A, B, C, D, E, F float64 }

var identity = affine{A: 1, E: 1}

// apply maps p.
func (m affine) apply(p Point) Point {
	return Point{m.A*p.X + m.B*p.Y + m.C, m.D*p.X + m.E*p.Y + m.F}
}

// vec maps a direction (no translation).
func (m affine) vec(x, y float64) (float64, float64) {
	return m.A*x + m.B*y, m.D*x + m.E*y
}

// then returns the map that applies m first and n second.
func (m affine) then(n affine) affine {
	return affine{
		A: n.A*m.A + n.B*m.D, B: n.A*m.B + n.B*m.E, C: n.A*m.C + n.B*m.F + n.C,
		D: n.D*m.A + n.E*m.D, E: n.D*m.B + n.E*m.E, F: n.D*m.C + n.E*m.F + n.F,
	}
}

func (m affine) det() float64 { return m.A*m.E - m.B*m.D }

// similar reports whether m is a similarity (uniform scale, rotation,
// perhaps a mirror), so circles stay circles.
func (m affine) similar() bool {
	l1 := math.Hypot(m.A, m.D)
	l2 := math.Hypot(m.B, m.E)
	dot := m.A*m.B + m.D*m.E
	s := math.Max(l1, l2)
	return s > 0 && math.Abs(l1-l2) <= 1e-9*s && math.Abs(dot) <= 1e-9*s*s
}

// lengthScale is the factor m applies to lengths (exact for a similarity,
// the geometric mean otherwise).
func (m affine) lengthScale() float64 { return math.Sqrt(math.Abs(m.det())) }

// angleDeg maps the direction at angle deg and returns its new angle in
// degrees, normalised to [0, 360).
func (m affine) angleDeg(deg float64) float64 {
	r := deg * math.Pi / 180
	x, y := m.vec(math.Cos(r), math.Sin(r))
	a := math.Atan2(y, x) * 180 / math.Pi
	if a < 0 {
		a += 360
	}
	if a >= 360 {
		a -= 360
	}
	return a
}

// vec3 is a 3D vector, used only for the OCS.
type vec3 struct{ X, Y, Z float64 }

func (a vec3) cross(b vec3) vec3 {
	return vec3{a.Y*b.Z - a.Z*b.Y, a.Z*b.X - a.X*b.Z, a.X*b.Y - a.Y*b.X}
}

func (a vec3) unit() vec3 {
	l := math.Sqrt(a.X*a.X + a.Y*a.Y + a.Z*a.Z)
	if l == 0 {
		return vec3{0, 0, 1}
	}
	return vec3{a.X / l, a.Y / l, a.Z / l}
}

// ocsMap returns the map from an entity's object coordinate system to
// world X/Y (dropping world Z), by the DXF "arbitrary axis algorithm":
// Ax = Wy x N when |Nx| and |Ny| are both below 1/64, else Wz x N; Ay =
// N x Ax. elev is the OCS Z of the entity's plane; it moves the plane and
// so shifts the projection when N is tilted. For N = (0,0,-1), the usual
// mirrored entity, the map is x' = -x, y' = y.
func ocsMap(n vec3, elev float64) affine {
	if n.X == 0 && n.Y == 0 && n.Z > 0 {
		return identity
	}
	n = n.unit()
	var ax vec3
	if math.Abs(n.X) < 1.0/64 && math.Abs(n.Y) < 1.0/64 {
		ax = vec3{0, 1, 0}.cross(n).unit()
	} else {
		ax = vec3{0, 0, 1}.cross(n).unit()
	}
	ay := n.cross(ax).unit()
	return affine{A: ax.X, B: ay.X, C: n.X * elev, D: ax.Y, E: ay.Y, F: n.Y * elev}
}

// tilted reports whether an extrusion is not along world ±Z; such
// entities are projected onto the XY plane.
func tilted(n vec3) bool {
	l := math.Sqrt(n.X*n.X + n.Y*n.Y + n.Z*n.Z)
	return l > 0 && math.Abs(math.Abs(n.Z)/l-1) > 1e-9
}
