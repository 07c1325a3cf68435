package export

import (
	"hash/crc32"

	"github.com/xuri/excelize/v2"
)

// SchedulePrep is the Members sheet's rows of a schedule, built and
// deflated ahead of the rest of the workbook (PrepareXLSX): the rows
// depend on the members alone, so a run can build them while it still
// works out what the other sheets hold (the load path), and WriteXLSXWith
// then splices them in as they are.
type SchedulePrep struct {
	done    chan struct{}
	members []Member // the members the rows were built from
	rows    preparedRows
	err     error
}

// preparedRows are a spliced sheet's rows deflated (sync-flushed pieces
// that join into one deflate stream), with their CRC-32 (IEEE) and
// lengths, for the part that will hold them.
type preparedRows struct {
	pieces   [][]byte
	crc      uint32
	raw, cmp uint64
}

// PrepareXLSX starts building r's Members rows on every core and returns
// at once; WriteXLSXWith waits for them. The rows read r.Members, which
// must not change meanwhile.
func PrepareXLSX(r *Results) *SchedulePrep {
	p := &SchedulePrep{done: make(chan struct{}), members: r.Members}
	go func() {
		defer close(p.done)
		// the styles' ids as writeXLSX makes them: the same calls on a
		// workbook of its own
		f := excelize.NewFile()
		defer f.Close()
		st, err := newStyles(f)
		if err != nil {
			p.err = err
			return
		}
		ms := p.members
		p.err = rowBlocks(st, len(ms), len(membersColumns), func(s *rowCells, i int) { memberRow(s, &ms[i]) },
			func(b rowBlock) error {
				p.rows.crc = crc32.Update(p.rows.crc, crc32.IEEETable, b.raw)
				p.rows.raw += uint64(len(b.raw))
				p.rows.cmp += uint64(len(b.deflated))
				p.rows.pieces = append(p.rows.pieces, b.deflated)
				return nil
			})
	}()
	return p
}

// rowsFor returns the prepared rows when they were built from members
// (the same slice, the same length), else nil: a schedule of other
// members builds its own.
func (p *SchedulePrep) rowsFor(members []Member) *preparedRows {
	if p == nil {
		return nil
	}
	<-p.done
	if p.err != nil || len(p.members) != len(members) || (len(members) > 0 && &p.members[0] != &members[0]) {
		return nil
	}
	return &p.rows
}

// crc32Combine returns the CRC-32 (IEEE) of a then b from crcA, crcB and
// b's length: the zero bits b's length adds to a, applied as powers of the
// CRC's shift matrix over GF(2) (the method of zlib's crc32_combine).
func crc32Combine(crcA, crcB uint32, lenB uint64) uint32 {
	if lenB == 0 {
		return crcA
	}
	var even, odd [32]uint32
	odd[0] = 0xedb88320 // the IEEE polynomial, reflected
	row := uint32(1)
	for n := 1; n < 32; n++ {
		odd[n] = row
		row <<= 1
	}
	gf2Square(&even, &odd) // two zero bits
	gf2Square(&odd, &even) // four
	for {
		gf2Square(&even, &odd) // the first round: one zero byte
		if lenB&1 != 0 {
			crcA = gf2Times(&even, crcA)
		}
		lenB >>= 1
		if lenB == 0 {
			break
		}
		gf2Square(&odd, &even)
		if lenB&1 != 0 {
			crcA = gf2Times(&odd, crcA)
		}
		lenB >>= 1
		if lenB == 0 {
			break
		}
	}
	return crcA ^ crcB
}

func gf2Times(mat *[32]uint32, vec uint32) uint32 {
	var sum uint32
	for i := 0; vec != 0; i, vec = i+1, vec>>1 {
		if vec&1 != 0 {
			sum ^= mat[i]
		}
	}
	return sum
}

func gf2Square(square, mat *[32]uint32) {
	for n := range 32 {
		square[n] = gf2Times(mat, mat[n])
	}
}
