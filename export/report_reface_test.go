package export

import "testing"

// TestRefaceTextFromCheckOrigin: the bracing text of a calculation gives
// positions as the check took the member, from its first bearing's
// centre-line when the drawn end stops short of it (here 0.75 in short):
// the report re-measures them from the datum (the bearing's face, DatumIn
// from the drawn start) as the member's other lines do, to 1/16 in.
// Arithmetic: 0 - 0.75 - 2 = -2.75 in; 168 - 0.75 - 2 = 165.25 in =
// 13'-9 1/4"; 56.25 - 0.75 - 2 = 53.5 in = 4'-5 1/2" (common practice,
// no source).
func TestRefaceTextFromCheckOrigin(t *testing.T) {
	m := &Member{BearingsAtIn: []float64{-0.75, 167.25}, DatumIn: 2}
	got := refaceText("bearings at 0, 168 in, each bracing both edges; rows to add at 56.25 in (evenly spaced in every span)", m)
	want := `bearings at -0'-2 3/4", 13'-9 1/4", each bracing both edges; rows to add at 4'-5 1/2" (evenly spaced in every span)`
	if got != want {
		t.Errorf("refaceText:\n got %s\nwant %s", got, want)
	}
	// a member drawn onto its bearing: positions are from its start
	m = &Member{BearingsAtIn: []float64{2.25, 146.25}, DatumIn: 5}
	if got, want := refaceText("bearings at 2.25, 146.25 in", m), `bearings at -0'-2 3/4", 11'-9 1/4"`; got != want {
		t.Errorf("refaceText: got %s, want %s", got, want)
	}
}
