package dxfimport

import (
	"fmt"
	"math"
	"strings"
)

// block is a block definition: its entities in block coordinates,
// drawing units.
type block struct {
	name     string
	base     Point
	line     int
	ents     []local
	cnt      int // entities one insert expands to (memo)
	cntState int // 0 not counted, 1 counting, 2 counted
}

// emit sends an entity to the block being read, or places it in model
// space.
func (r *reader) emit(l *local) {
	if r.cur != nil {
		r.cur.ents = append(r.cur.ents, *l)
		return
	}
	if l.ins != nil {
		if r.blocks[strings.ToUpper(l.ins.name)] == nil && !r.finishing {
			r.deferred = append(r.deferred, *l)
			return
		}
		r.emitInsert(l)
		return
	}
	if !r.keep(l.e.Pos.Layer) {
		r.drop(&l.e)
		return
	}
	if r.ents.n >= r.opt.MaxEntities {
		r.hitLimit(l.e.Pos, 1)
		return
	}
	k := r.d.ToInch
	r.placeWarn(&l.e, &l.e, affine{A: k, E: k})
	r.add(&l.e)
}

// add appends a placed entity unless a coordinate overflowed.
func (r *reader) add(e *Entity) {
	for _, p := range e.Points {
		if math.IsInf(p.X, 0) || math.IsInf(p.Y, 0) || math.IsNaN(p.X) || math.IsNaN(p.Y) {
			r.warnOnce("overflow", e.Pos, "DXF112", SevError,
				"%s coordinates overflow when converted to inches; left out", e.Kind)
			return
		}
	}
	r.ents.add(e)
}

// keep reports whether entities on layer are kept (Options.Keep).
func (r *reader) keep(layer string) bool {
	if r.opt.Keep == nil {
		return true
	}
	k, ok := r.kept[layer]
	if !ok {
		if r.kept == nil {
			r.kept = map[string]bool{}
		}
		k = r.opt.Keep(layer)
		r.kept[layer] = k
	}
	return k
}

// drop counts an entity of model space that is not kept, and gives its
// points back to the slab when they were the last handed out.
func (r *reader) drop(e *Entity) {
	r.dropIn(e.Kind, e.Pos.Layer, e.Pos.Layer)
	s := &r.slab
	if n := len(e.Points); n > 0 && n <= 64 && len(s.pts) >= n && &s.pts[len(s.pts)-n] == &e.Points[0] {
		s.pts = s.pts[:len(s.pts)-n]
	}
}

// dropIn counts a dropped entity drawn on layer lay, which takes parent
// when it is "0" (a block entity on layer 0 takes the insert's layer).
func (r *reader) dropIn(k Kind, lay, parent string) {
	if lay == "0" {
		lay = parent
	}
	m := r.d.Dropped[lay]
	if m == nil {
		m = map[Kind]int{}
		r.d.Dropped[lay] = m
	}
	m[k]++
}

// keepsAny reports whether an insert of b on layer places any entity on
// a kept layer, nested inserts included (a block inserting itself adds
// nothing new).
func (r *reader) keepsAny(b *block, layer string, stack []*block) bool {
	if r.opt.Keep == nil {
		return true
	}
	key := b.name + "\x00" + layer
	if v, ok := r.keepsMemo[key]; ok {
		return v
	}
	for _, s := range stack {
		if s == b {
			return false
		}
	}
	stack = append(stack, b)
	any := false
	for i := range b.ents {
		lay := b.ents[i].e.Pos.Layer
		if lay == "0" {
			lay = layer
		}
		if in := b.ents[i].ins; in != nil {
			if c := r.blocks[strings.ToUpper(in.name)]; c != nil && r.keepsAny(c, lay, stack) {
				any = true
				break
			}
			continue
		}
		if r.keep(lay) {
			any = true
			break
		}
	}
	if r.keepsMemo == nil {
		r.keepsMemo = map[string]bool{}
	}
	r.keepsMemo[key] = any
	return any
}

// countText writes an entity count, saturated counts as "more than".
func countText(n int) string {
	if n > HardMaxEntities {
		return fmt.Sprintf("more than %d", HardMaxEntities)
	}
	return fmt.Sprint(n)
}

// hitLimit reports the entity limit once.
func (r *reader) hitLimit(pos Pos, n int) {
	adds := fmt.Sprint(n)
	if n > HardMaxEntities { // the count saturated (satMul, satAdd)
		adds = fmt.Sprintf("more than %d", HardMaxEntities)
	}
	r.warnOnce("limit", pos, "DXF105", SevError,
		"the drawing would hold more than %d entities (this one adds %s); the rest is left out", r.opt.MaxEntities, adds)
}

// workBudget is how many block copies expand may place in one Read: room
// for every entity allowed plus as many empty or cut copies again.
func workBudget(maxEntities int) int { return 2*maxEntities + 1_000_000 }

// grid returns the MINSERT columns and rows, as ezdxf yields them: at
// least one of each, and one only when its spacing is zero (the copies
// would coincide).
func grid(in *insertRef) (cols, rows int) {
	cols, rows = max(in.cols, 1), max(in.rows, 1)
	if in.dc == 0 {
		cols = 1
	}
	if in.dr == 0 {
		rows = 1
	}
	return cols, rows
}

// satMul and satAdd saturate just above HardMaxEntities.
func satMul(a, b int) int {
	if a == 0 || b == 0 {
		return 0
	}
	if a > (HardMaxEntities+1)/b {
		return HardMaxEntities + 1
	}
	return min(a*b, HardMaxEntities+1)
}

func satAdd(a, b int) int { return min(a+b, HardMaxEntities+1) }

// count returns how many entities and nested inserts one insert of b
// expands to: an estimate of the work, exact for acyclic blocks (a
// self-insert counts as one, depth limits are ignored). The work budget
// in expand bounds the rest.
func (r *reader) count(b *block) int {
	switch b.cntState {
	case 1:
		return 0
	case 2:
		return b.cnt
	}
	b.cntState = 1
	n := 0
	for i := range b.ents {
		in := b.ents[i].ins
		if in == nil {
			n = satAdd(n, 1)
			continue
		}
		n = satAdd(n, 1)
		if c := r.blocks[strings.ToUpper(in.name)]; c != nil {
			cols, rows := grid(in)
			n = satAdd(n, satMul(satMul(cols, rows), r.count(c)))
		}
	}
	b.cnt, b.cntState = n, 2
	return n
}

// emitInsert expands a model-space INSERT into world entities.
func (r *reader) emitInsert(l *local) {
	in := l.ins
	b := r.blocks[strings.ToUpper(in.name)]
	if b != nil {
		cols, rows := grid(in)
		n := satMul(satMul(cols, rows), r.count(b))
		if r.ents.n+n > r.opt.MaxEntities {
			if !r.keepsAny(b, l.e.Pos.Layer, nil) {
				// Noise only: every entity the caller uses is read all
				// the same, so this is no doubt about them.
				r.d.Issues.Add(l.e.Pos, "DXF105", SevWarning,
					"an insert of block %q would add %s entities, none on a layer in use; left out uncounted", in.name, countText(n))
				return
			}
			r.hitLimit(l.e.Pos, n)
			return
		}
	}
	k := r.d.ToInch
	from := l.e.Pos
	r.expand(in, l.e.Pos, &from, affine{A: k, E: k}, "0", 1, nil)
}

// expand places the entities of the block that in inserts, through the
// parent map m. pos is the INSERT's own position, from the outermost
// model-space INSERT's; parentLayer is the layer that entities on layer
// "0" take (DXF rule: block entities on layer 0 take the layer of the
// INSERT).
func (r *reader) expand(in *insertRef, pos Pos, from *Pos, m affine, parentLayer string, depth int, stack []string) {
	key := strings.ToUpper(in.name)
	b := r.blocks[key]
	if b == nil {
		r.warnOnce("noblock:"+key, pos, "DXF103", SevWarning, "INSERT of block %q, which is not defined; left out", in.name)
		return
	}
	for _, s := range stack {
		if s == key {
			r.warnOnce("cycle:"+key, pos, "DXF104", SevWarning,
				"block %q inserts itself (through %s); the inner insert is left out", in.name, strings.Join(stack, " > "))
			return
		}
	}
	if depth > r.opt.MaxInsertDepth {
		r.warnOnce("deep", pos, "DXF104", SevWarning,
			"blocks nested more than %d deep (at block %q); the deeper inserts are left out", r.opt.MaxInsertDepth, in.name)
		return
	}
	if len(b.ents) == 0 || r.stop {
		return
	}
	layer := pos.Layer
	if layer == "0" {
		layer = parentLayer
	}
	stack = append(stack, key)
	ocs := ocsMap(in.n, in.at.Z)
	sin, cos := math.Sincos(in.rotDeg * math.Pi / 180)
	cols, rows := grid(in)
	for row := 0; row < rows; row++ {
		for col := 0; col < cols; col++ {
			// Every placed copy costs work even if nothing in it is
			// kept (a cycle cut, an undefined block): bound it.
			if r.work++; r.work > workBudget(r.opt.MaxEntities) {
				r.hitLimit(*from, cols*rows)
				r.stop = true
			}
			if r.stop {
				return
			}
			// MINSERT offsets are rotated with the insert but not
			// scaled (ezdxf Insert.multi_insert; DXF Reference, INSERT).
			ox, oy := float64(col)*in.dc, float64(row)*in.dr
			tx := in.at.X + ox*cos - oy*sin
			ty := in.at.Y + ox*sin + oy*cos
			// block point p -> OCS: R * S * (p - base) + insertion.
			t := affine{
				A: cos * in.sx, B: -sin * in.sy, D: sin * in.sx, E: cos * in.sy,
			}
			t.C = tx - t.A*b.base.X - t.B*b.base.Y
			t.F = ty - t.D*b.base.X - t.E*b.base.Y
			mm := t.then(ocs).then(m)
			for i := range b.ents {
				src := &b.ents[i]
				if src.ins != nil {
					r.expand(src.ins, src.e.Pos, from, mm, layer, depth+1, stack)
					continue
				}
				if lay := src.e.Pos.Layer; (lay == "0" && !r.keep(layer)) || (lay != "0" && !r.keep(lay)) {
					r.dropIn(src.e.Kind, lay, layer)
					continue
				}
				if r.ents.n >= r.opt.MaxEntities {
					r.hitLimit(*from, 1)
					r.stop = true
					return
				}
				e := src.e
				e.Points = r.newPoints(len(src.e.Points))
				if src.e.Bulges != nil {
					e.Bulges = make([]float64, len(src.e.Bulges))
				}
				r.placeWarn(&src.e, &e, mm)
				if e.Pos.Layer == "0" {
					e.Pos.Layer = layer
				}
				e.From = from
				r.add(&e)
			}
		}
	}
}

// placeWarn is place with a warning when a circle, arc or text is
// distorted by a non-uniform scale.
func (r *reader) placeWarn(src, dst *Entity, m affine) {
	if !place(src, dst, m) {
		r.warnOnce("nonuniform", src.Pos, "DXF108", SevWarning,
			"%s under a non-uniform block scale: its radius or height is approximated", src.Kind)
	}
}

// place maps src through m into dst (which may be src itself; dst.Points
// and dst.Bulges are allocated by the caller). A mirror (det < 0) negates
// bulges and swaps arc start and end. It returns false when a circle, arc
// or text is distorted, m not being a similarity.
func place(src, dst *Entity, m affine) bool {
	for i, p := range src.Points {
		dst.Points[i] = m.apply(p)
	}
	det := m.det()
	if src.Bulges != nil {
		for i, b := range src.Bulges {
			if det < 0 && b != 0 {
				b = -b
			}
			dst.Bulges[i] = b
		}
	}
	switch src.Kind {
	case KindCircle, KindArc:
		s, e := src.StartDeg, src.EndDeg
		dst.RadiusIn = src.RadiusIn * m.lengthScale()
		if src.Kind == KindArc {
			if det < 0 {
				s, e = e, s
			}
			dst.StartDeg, dst.EndDeg = m.angleDeg(s), m.angleDeg(e)
		}
		return m.similar()
	case KindText, KindMText:
		rad := src.RotationDeg * math.Pi / 180
		hx, hy := m.vec(-math.Sin(rad), math.Cos(rad))
		dst.HeightIn = src.HeightIn * math.Hypot(hx, hy)
		dst.RotationDeg = m.angleDeg(src.RotationDeg)
		return m.similar()
	}
	return true
}

// atan2Deg is atan2 in degrees.
func atan2Deg(y, x float64) float64 { return math.Atan2(y, x) * 180 / math.Pi }

// entityStore collects entities in chunks and makes the final slice once,
// so a large drawing costs one copy of the Entity structs instead of the
// repeated copies of a growing slice: peak memory stays under twice the
// entities' own size.
type entityStore struct {
	chunks [][]Entity
	n      int
}

func (s *entityStore) add(e *Entity) {
	k := len(s.chunks) - 1
	if k < 0 || len(s.chunks[k]) == cap(s.chunks[k]) {
		size := 16
		if k >= 0 {
			size = min(2*cap(s.chunks[k]), 4096)
		}
		s.chunks = append(s.chunks, make([]Entity, 0, size))
		k++
	}
	s.chunks[k] = append(s.chunks[k], *e)
	s.n++
}

// slice returns all entities in order and empties the store.
func (s *entityStore) slice() []Entity {
	if s.n == 0 {
		return nil
	}
	if len(s.chunks) == 1 {
		out := s.chunks[0]
		s.chunks = nil
		return out
	}
	out := make([]Entity, 0, s.n)
	for i, c := range s.chunks {
		out = append(out, c...)
		s.chunks[i] = nil
	}
	s.chunks = nil
	return out
}
