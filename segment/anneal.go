package segment

// Schedule gives the temperature of iteration k (0-based) of n. Sampling
// at temperature T raises every conditional probability to the power 1/T.
type Schedule func(k, n int) float64

// Annealed is the default schedule, modelled on Goldwater, Griffiths &
// Johnson (2009), who lowered the temperature in ten steps to 1 (the exact
// steps here are recalled from memory, not copied from the paper): the
// iterations are cut into ten equal blocks and block j (0-based) runs at
// temperature 10/(j+1), i.e. gamma = 1/T rises 0.1, 0.2, ..., 1.0. The last
// tenth of the run is at temperature 1.
func Annealed(k, n int) float64 {
	if n <= 0 {
		return 1
	}
	j := 10 * k / n
	if j > 9 {
		j = 9
	}
	return 10 / float64(j+1)
}

// Constant returns a schedule that always gives temperature t.
func Constant(t float64) Schedule { return func(int, int) float64 { return t } }
