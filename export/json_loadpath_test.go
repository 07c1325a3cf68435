package export

import (
	"bufio"
	"bytes"
	"encoding/json"
	"fmt"
	"strconv"
	"testing"

	"github.com/stretchr/testify/require"
)

// TestLoadPathJSONStreamed: the load path written item by item reads back
// as json.Marshal writes the whole section (the same keys and values,
// null for a nil list, [] for an empty one), rounded as schema 3 rounds
// it (encoding/json documentation; common practice, no source).
func TestLoadPathJSONStreamed(t *testing.T) {
	for _, lp := range []*LoadPath{
		{},
		{Posts: []PathPost{}},
		{
			Beams: []PathBeam{{ID: "B1", Mark: "B1", Kind: "flush-beam", Size: "6x14", MaxRatio: 0.35000000000000003,
				SpansIn: []float64{152.81250000000003}, Checks: []Check{{Kind: "bending-top", Combo: "D+L", Actual: 393.91234567, Allowable: 1331, Unit: "psi", Ratio: 0.296}}}},
			Posts: []PathPost{{ID: "P1", At: [2]float64{5328, -1.1102230246251565e-16}, Size: "6x6", HeightIn: 96,
				Loads: TypeLoads{DeadLb: 1234.5000000001, LiveLb: 4000}}},
			Connections: []Connection{{Kind: "hanger", Member: "M1", Bearing: 2, Carrier: "B1", DownLb: 96.00000000000001}},
			Foundation:  []FoundationLine{{Kind: "wall", ID: "W1", LengthIn: 240, Loads: TypeLoads{DeadLb: 10}}},
			Applied:     TypeLoads{DeadLb: 1.0000000000000002},
			Delivered:   TypeLoads{DeadLb: 1},
		},
	} {
		var buf bytes.Buffer
		w := bufio.NewWriter(&buf)
		require.NoError(t, writeLoadPathJSON(w, lp, roundedCopy))
		require.NoError(t, w.Flush())
		var got, want any
		require.NoError(t, json.Unmarshal(buf.Bytes(), &got), buf.String())
		whole, err := json.Marshal(roundedCopy(lp))
		require.NoError(t, err)
		require.NoError(t, json.Unmarshal(whole, &want))
		require.Equal(t, want, got)
	}
}

// TestBlockEncoderSameBytes: items asked for in order through blockEncoder
// come back as enc makes them, across several blocks and on any number of
// goroutines, errors included (common practice, no source).
func TestBlockEncoderSameBytes(t *testing.T) {
	n := 2*encodeBlock + 123
	enc := func(i int) ([]byte, error) {
		if i == encodeBlock+7 {
			return nil, fmt.Errorf("item %d", i)
		}
		return []byte(strconv.Itoa(i * 3)), nil
	}
	get := blockEncoder(n, enc)
	for i := 0; i < n; i++ {
		b, err := get(i)
		wb, werr := enc(i)
		if string(b) != string(wb) || (err == nil) != (werr == nil) {
			t.Fatalf("item %d: %q, %v; want %q, %v", i, b, err, wb, werr)
		}
	}
}
