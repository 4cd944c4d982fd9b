package main

import "slices"

// This file holds the invented Kelaru lexicon. Every list is ordered from
// the most to the least frequent word: the grammar draws from a list with
// Zipfian weights by position (see zipf in grammar.go).

// class is a set of semantic features of a noun; verbs and adjectives say
// which features their arguments need, so that sentences stay plausible.
type class uint32

const (
	human     class = 1 << iota
	animal          // living creature other than a person
	food            // eaten
	cookable        // eaten after cooking
	drink           // drunk
	portable        // can be carried, taken, held
	made            // made by hand
	built           // built: houses, boats
	place           // can be the site or goal of an event
	goods           // bought and sold
	plant           // planted
	washable        // washed
	cuttable        // cut
	falls           // falls down
	burnable        // burned
	fire            // burns by itself
	light           // shines
	wind            // blows
	sound           // can be heard
	song            // sung
	story           // told
	knowable        // known: people, stories, ways
	visitable       // visited
	catchable       // caught
	swimming        // a place to swim in
	vehicle         // arrives somewhere by itself
	liquid          // a place that is a body of water
	aquatic         // lives in water: swims, does not walk
	kin             // a relative: usually said with a possessor
	own             // can have a possessor
)

// noun is a common noun with its English singular and plural and the
// English preposition that renders the locative postposition after it.
type noun struct {
	form   string
	sg, pl string
	class  class
	prep   string // English for "lo" after this noun; "" if not a place
	mass   bool   // no plural, no indefinite article
	unique bool   // always "the": the sun, the sea
}

// nouns are the common nouns, most frequent first.
var nouns = []noun{
	{form: "ʃara", sg: "fish", pl: "fish", class: aquatic | food | cookable | portable | goods | catchable},
	{form: "sapu", sg: "house", pl: "houses", class: place | built | own | visitable, prep: "in"},
	{form: "popo", sg: "child", pl: "children", class: human | own | washable | knowable},
	{form: "wasi", sg: "water", class: drink | portable | place | swimming | liquid, prep: "in", mass: true},
	{form: "siri", sg: "woman", pl: "women", class: human | knowable},
	{form: "tane", sg: "man", pl: "men", class: human | knowable},
	{form: "soma", sg: "friend", pl: "friends", class: human | own | knowable},
	{form: "wiru", sg: "dog", pl: "dogs", class: animal | own | washable | sound},
	{form: "lakʷa", sg: "boat", pl: "boats", class: place | built | own | vehicle, prep: "in"},
	{form: "ʔaŋa", sg: "food", class: food | cookable | portable, mass: true},
	{form: "nuŋgol", sg: "village", pl: "villages", class: place | own | knowable | visitable, prep: "in"},
	{form: "rikʷe", sg: "river", pl: "rivers", class: place | swimming | sound | visitable, prep: "at"},
	{form: "haːpa", sg: "garden", pl: "gardens", class: place | own | visitable, prep: "in"},
	{form: "gure", sg: "yam", pl: "yams", class: food | cookable | plant | portable | goods | cuttable},
	{form: "ʔime", sg: "mother", pl: "mothers", class: human | kin | own | knowable},
	{form: "hobo", sg: "father", pl: "fathers", class: human | kin | own | knowable},
	{form: "mun", sg: "person", pl: "people", class: human | knowable},
	{form: "liŋa", sg: "elder", pl: "elders", class: human | knowable},
	{form: "kuku", sg: "chicken", pl: "chickens", class: animal | food | cookable | goods | own | catchable | sound},
	{form: "noru", sg: "coconut", pl: "coconuts", class: food | drink | plant | portable | goods | cuttable | falls},
	{form: "t͡ʃoba", sg: "basket", pl: "baskets", class: portable | made | goods | own},
	{form: "seŋa", sg: "beach", pl: "beaches", class: place | visitable, prep: "on"},
	{form: "tomal", sg: "sea", class: place | swimming | sound | liquid, prep: "in", unique: true},
	{form: "dene", sg: "tree", pl: "trees", class: plant | place | cuttable, prep: "under"},
	{form: "lupa", sg: "fruit", pl: "fruits", class: food | portable | goods | cuttable | falls},
	{form: "pʰa", sg: "fire", pl: "fires", class: place | fire, prep: "by"},
	{form: "rumaʃ", sg: "net", pl: "nets", class: portable | made | goods | own},
	{form: "boŋ", sg: "pig", pl: "pigs", class: animal | goods | own | catchable | sound},
	{form: "piri", sg: "bird", pl: "birds", class: animal | catchable | sound},
	{form: "jaru", sg: "path", pl: "paths", class: place | knowable, prep: "on"},
	{form: "liwa", sg: "song", pl: "songs", class: song | sound | knowable},
	{form: "tʰomisawe", sg: "story", pl: "stories", class: story | sound | knowable},
	{form: "muruŋ", sg: "pot", pl: "pots", class: portable | made | goods | washable | own},
	{form: "kiret", sg: "knife", pl: "knives", class: portable | made | goods | own},
	{form: "mesiŋ", sg: "taro", pl: "taro", class: food | cookable | plant | portable | goods | cuttable},
	{form: "pu", sg: "egg", pl: "eggs", class: food | cookable | portable | goods},
	{form: "hoso", sg: "rain", class: falls | sound, mass: true},
	{form: "kolem", sg: "stone", pl: "stones", class: portable | falls},
	{form: "wekʷa", sg: "rope", pl: "ropes", class: portable | made | goods | cuttable},
	{form: "pol", sg: "hill", pl: "hills", class: place | visitable, prep: "on"},
	{form: "seli", sg: "sun", class: light, unique: true},
	{form: "kʷira", sg: "moon", class: light, unique: true},
	{form: "pise", sg: "shell", pl: "shells", class: portable | goods},
	{form: "lapi", sg: "leaf", pl: "leaves", class: portable | cuttable | falls | burnable},
	{form: "wuru", sg: "wind", class: wind | sound, mass: true, unique: true},
	{form: "gamu", sg: "salt", class: portable | goods, mass: true},
	{form: "tʰuri", sg: "cloth", class: portable | made | goods | washable | cuttable | own, mass: true},
	{form: "pʰalo", sg: "torch", pl: "torches", class: portable | made | burnable | fire},
	{form: "meme", sg: "goat", pl: "goats", class: animal | goods | own | catchable | sound},
	{form: "hiso", sg: "sand", class: place, prep: "on", mass: true},
}

// verb is a verb with its English forms. A verb has a transitive use when
// obj is not zero and an intransitive use when isubj is not zero.
type verb struct {
	form                string
	base, s3, past, ing string
	subj, obj           class  // transitive use
	isubj               class  // intransitive use
	motion              bool   // takes a goal (ALL) or a source (ABL)
	goalPrep            string // English for the goal postposition "tu"
	static              bool   // takes a locative (LOC)
	stative             bool   // no progressive in English
	locClass            class  // places the locative may name; 0 means any place
}

// verbs are the verbs, most frequent first.
var verbs = []verb{
	{form: "ka", base: "go", s3: "goes", past: "went", ing: "going", isubj: human | animal, motion: true, goalPrep: "to"},
	{form: "ʔam", base: "eat", s3: "eats", past: "ate", ing: "eating", subj: human | animal, obj: food, static: true},
	{form: "ʔit", base: "see", s3: "sees", past: "saw", ing: "seeing", subj: human | animal, obj: human | animal | portable | built | light | plant, stative: true},
	{form: "wen", base: "come", s3: "comes", past: "came", ing: "coming", isubj: human | animal, motion: true, goalPrep: "to"},
	{form: "kumo", base: "cook", s3: "cooks", past: "cooked", ing: "cooking", subj: human, obj: cookable, static: true},
	{form: "sam", base: "sleep", s3: "sleeps", past: "slept", ing: "sleeping", isubj: human | animal, static: true},
	{form: "ras", base: "carry", s3: "carries", past: "carried", ing: "carrying", subj: human, obj: portable, static: true},
	{form: "tulu", base: "come back", s3: "comes back", past: "came back", ing: "coming back", isubj: human | animal, motion: true, goalPrep: "to"},
	{form: "wal", base: "make", s3: "makes", past: "made", ing: "making", subj: human, obj: made, static: true},
	{form: "kʷit", base: "take", s3: "takes", past: "took", ing: "taking", subj: human, obj: portable | food},
	{form: "lil", base: "sing", s3: "sings", past: "sang", ing: "singing", subj: human, obj: song, isubj: human | animal, static: true},
	{form: "dul", base: "sit", s3: "sits", past: "sat", ing: "sitting", isubj: human | animal, static: true},
	{form: "bunas", base: "bring", s3: "brings", past: "brought", ing: "bringing", subj: human, obj: portable | food | drink},
	{form: "ʃin", base: "hear", s3: "hears", past: "heard", ing: "hearing", subj: human | animal, obj: sound, stative: true},
	{form: "molo", base: "work", s3: "works", past: "worked", ing: "working", isubj: human, static: true},
	{form: "lok", base: "find", s3: "finds", past: "found", ing: "finding", subj: human | animal, obj: portable | animal | food, static: true},
	{form: "ʔori", base: "want", s3: "wants", past: "wanted", ing: "wanting", subj: human | animal, obj: food | drink | goods, stative: true},
	{form: "jom", base: "swim", s3: "swims", past: "swam", ing: "swimming", isubj: human | animal | aquatic, static: true, locClass: swimming},
	{form: "tal", base: "sell", s3: "sells", past: "sold", ing: "selling", subj: human, obj: goods, static: true},
	{form: "talin", base: "buy", s3: "buys", past: "bought", ing: "buying", subj: human, obj: goods, static: true},
	{form: "ʃiri", base: "run", s3: "runs", past: "ran", ing: "running", isubj: human | animal, motion: true, goalPrep: "to"},
	{form: "kes", base: "cut", s3: "cuts", past: "cut", ing: "cutting", subj: human, obj: cuttable, static: true},
	{form: "hem", base: "cry", s3: "cries", past: "cried", ing: "crying", isubj: human, static: true},
	{form: "taŋun", base: "plant", s3: "plants", past: "planted", ing: "planting", subj: human, obj: plant, static: true},
	{form: "ʃuli", base: "wash", s3: "washes", past: "washed", ing: "washing", subj: human, obj: washable, static: true},
	{form: "pʰek", base: "catch", s3: "catches", past: "caught", ing: "catching", subj: human | animal, obj: catchable, static: true},
	{form: "kaka", base: "laugh", s3: "laughs", past: "laughed", ing: "laughing", isubj: human},
	{form: "nomi", base: "know", s3: "knows", past: "knew", ing: "knowing", subj: human, obj: knowable, stative: true},
	{form: "tʰop", base: "arrive", s3: "arrives", past: "arrived", ing: "arriving", isubj: human | vehicle, motion: true, goalPrep: "at"},
	{form: "dok", base: "build", s3: "builds", past: "built", ing: "building", subj: human, obj: built},
	{form: "rasu", base: "dance", s3: "dances", past: "danced", ing: "dancing", isubj: human, static: true},
	{form: "kep", base: "hold", s3: "holds", past: "held", ing: "holding", subj: human, obj: portable},
	{form: "saŋ", base: "tell", s3: "tells", past: "told", ing: "telling", subj: human, obj: story, static: true},
	{form: "tawin", base: "walk", s3: "walks", past: "walked", ing: "walking", isubj: human | animal, motion: true, goalPrep: "to"},
	{form: "maru", base: "help", s3: "helps", past: "helped", ing: "helping", subj: human, obj: human},
	{form: "ʔuwe", base: "call", s3: "calls", past: "called", ing: "calling", subj: human, obj: human | animal},
	{form: "ʔuŋ", base: "fall", s3: "falls", past: "fell", ing: "falling", isubj: falls, static: true},
	{form: "tiwal", base: "visit", s3: "visits", past: "visited", ing: "visiting", subj: human, obj: human | visitable},
	{form: "nuŋ", base: "drink", s3: "drinks", past: "drank", ing: "drinking", subj: human | animal, obj: drink},
	{form: "tʰeŋ", base: "wait", s3: "waits", past: "waited", ing: "waiting", isubj: human, static: true},
	{form: "hoke", base: "play", s3: "plays", past: "played", ing: "playing", isubj: human | animal, static: true},
	{form: "pʰana", base: "burn", s3: "burns", past: "burned", ing: "burning", subj: human, obj: burnable, isubj: fire},
	{form: "pʰuʃ", base: "blow", s3: "blows", past: "blew", ing: "blowing", isubj: wind},
	{form: "ʃen", base: "shine", s3: "shines", past: "shone", ing: "shining", isubj: light},
}

// adjective is an adjective with the nouns it may describe: those with a
// feature in class, those listed by form in nouns, and people (pronouns and
// names too) when person is set. An adjective that is predicateOnly is not
// used inside a noun phrase ("the child is well", not "the well child"). A
// state comes and goes ("tired", "wet"), so it may be dated ("yesterday the
// child was tired"); other properties are mostly said in the present.
type adjective struct {
	form          string
	en            string
	class         class
	nouns         []string
	person        bool
	predicateOnly bool
	state         bool
	countOnly     bool // not for mass nouns: "the water is big" is odd
}

// sizeable are the features of things that are big or small.
const sizeable = human | animal | portable | built | place | plant

// adjectives are the adjectives, most frequent first.
var adjectives = []adjective{
	{form: "lemi", en: "big", class: sizeable, countOnly: true},
	{form: "lemu", en: "good", class: human | animal | food | made | built | place | song | story | plant},
	{form: "t͡ʃimi", en: "small", class: sizeable, countOnly: true},
	{form: "hapus", en: "tired", class: human, nouns: []string{"wiru"}, person: true, state: true},
	{form: "siŋe", en: "new", class: made | built},
	{form: "ʃiŋa", en: "happy", class: human, person: true, state: true},
	{form: "tuko", en: "old", class: made | built, nouns: []string{"dene", "tane", "siri", "liŋa", "hobo", "ʔime", "mun", "soma"}, person: true},
	{form: "lopʰo", en: "hungry", class: human | animal, person: true, state: true},
	{form: "kʷaru", en: "bad", class: food | made | built | song | story | animal},
	{form: "pʰeʃ", en: "hot", nouns: []string{"wasi", "ʔaŋa", "pʰa", "hiso", "muruŋ", "seli"}, state: true},
	{form: "reŋan", en: "long", nouns: []string{"jaru", "wekʷa", "tʰomisawe", "liwa", "tʰuri", "lakʷa", "rikʷe"}},
	{form: "ʔuto", en: "well", class: human, person: true, predicateOnly: true, state: true},
	{form: "mowa", en: "cold", nouns: []string{"wasi", "ʔaŋa", "wuru", "hoso", "tomal"}, state: true},
	{form: "mikʷi", en: "sick", class: human | animal, person: true, state: true},
	{form: "lusu", en: "sweet", nouns: []string{"lupa", "noru", "wasi", "gure", "ʔaŋa"}},
	{form: "jelimaso", en: "beautiful", nouns: []string{"liwa", "sapu", "pise", "tʰuri", "nuŋgol", "seŋa", "siri", "lakʷa", "kʷira"}},
	{form: "ʔoko", en: "heavy", nouns: []string{"kolem", "t͡ʃoba", "muruŋ", "rumaʃ", "noru", "lakʷa"}},
	{form: "raŋ", en: "red", nouns: []string{"lupa", "tʰuri", "piri", "ʃara", "pise", "kuku"}},
	{form: "dowa", en: "tall", nouns: []string{"dene", "tane", "siri", "liŋa", "hobo", "ʔime", "mun", "soma"}, person: true},
	{form: "pule", en: "white", nouns: []string{"pise", "tʰuri", "piri", "kolem", "kuku", "hiso", "meme", "pu"}},
	{form: "ʃamuʃ", en: "wet", nouns: []string{"tʰuri", "hiso", "lapi", "wiru", "popo"}, state: true},
	{form: "koʃom", en: "black", nouns: []string{"wiru", "boŋ", "kolem", "piri", "tʰuri", "meme", "muruŋ"}},
}

// describes reports whether a may describe n.
func (a *adjective) describes(n *noun) bool {
	if a.countOnly && (n.mass || n.unique) {
		return false
	}
	return a.class&n.class != 0 || slices.Contains(a.nouns, n.form)
}

// pronoun is a personal pronoun; the third person singular has no gender,
// and the English translation picks one per utterance.
type pronoun struct {
	form            string
	gloss           string
	subj, obj, poss string
	person          int
	plural          bool
}

// pronouns are the personal pronouns, most frequent first.
var pronouns = []pronoun{
	{form: "na", gloss: "I", subj: "I", obj: "me", poss: "my", person: 1},
	{form: "ʔo", gloss: "she, he", person: 3},
	{form: "ti", gloss: "you (sg.)", subj: "you", obj: "you", poss: "your", person: 2},
	{form: "naŋ", gloss: "we", subj: "we", obj: "us", poss: "our", person: 1, plural: true},
	{form: "ʔoru", gloss: "they", subj: "they", obj: "them", poss: "their", person: 3, plural: true},
	{form: "tis", gloss: "you (pl.)", subj: "you", obj: "you", poss: "your", person: 2, plural: true},
}

// name is a personal name and its English spelling.
type name struct{ form, en string }

// names are the personal names, most frequent first.
var names = []name{
	{"temari", "Temari"},
	{"nawin", "Nawin"},
	{"kʷaloŋ", "Kwalong"},
	{"siʃa", "Sisha"},
	{"bores", "Bores"},
	{"t͡ʃamon", "Chamon"},
	{"lepʰu", "Lephu"},
	{"goma", "Goma"},
}

// numeral is a numeral or quantifier that follows the noun.
type numeral struct {
	form, en string
	plural   bool // the noun is plural in English
}

// numerals are the numerals and quantifiers, most frequent first.
var numerals = []numeral{
	{"gel", "two", true},
	{"bosu", "many", true},
	{"ʔes", "one", false},
	{"tʰaro", "three", true},
	{"keʃa", "all", true},
	{"kʷan", "four", true},
	{"nopʰe", "five", true},
}

// timeWord is a time adverb with the tenses it goes with.
type timeWord struct {
	form, en string
	past     bool
	present  bool
	future   bool
}

// timeWords are the time adverbs, most frequent first.
var timeWords = []timeWord{
	{form: "ʃolo", en: "yesterday", past: true},
	{form: "nisa", en: "today", past: true, present: true, future: true},
	{form: "ʃolomi", en: "tomorrow", future: true},
	{form: "kaːn", en: "now", present: true},
	{form: "pʰoni", en: "in the morning", past: true, present: true, future: true},
	{form: "ʔumul", en: "at night", past: true, present: true, future: true},
}

// adverb is a manner or place adverb.
type adverb struct{ form, en string }

// mannerAdverbs come before the verb.
var mannerAdverbs = []adverb{
	{"tʰuli", "again"},
	{"ʃuʃu", "quickly"},
	{"lolo", "slowly"},
}

// placeAdverbs stand in for a locative or goal phrase.
var placeAdverbs = []adverb{
	{"kir", "here"},
	{"wur", "there"},
}

// word is a word listed in the lexicon with its gloss and part of speech.
type word struct{ form, gloss, pos string }

// Function words, interjections and question words. The grammar refers to
// them by these names; glosses of grammatical words follow the Leipzig
// Glossing Rules abbreviations.
var (
	wObj    = word{"ni", "OBJ", "postposition"}
	wLoc    = word{"lo", "LOC", "postposition"}
	wAll    = word{"tu", "ALL", "postposition"}
	wAbl    = word{"maʃ", "ABL", "postposition"}
	wCom    = word{"sen", "COM", "postposition"}
	wPast   = word{"ke", "PST", "particle"}
	wFut    = word{"reŋ", "FUT", "particle"}
	wNeg    = word{"mo", "NEG", "particle"}
	wQ      = word{"pa", "Q", "particle"}
	wImp    = word{"ko", "IMP", "particle"}
	wPl     = word{"ta", "PL", "particle"}
	wThis   = word{"ki", "this", "demonstrative"}
	wThat   = word{"wu", "that", "demonstrative"}
	wAnd    = word{"ja", "and", "conjunction"}
	wThen   = word{"daŋ", "and then", "conjunction"}
	wVery   = word{"hu", "very", "adverb"}
	wCop    = word{"ne", "COP", "verb"}
	wAlso   = word{"bi", "also", "particle"}
	wWhat   = word{"kʷe", "what", "question word"}
	wWho    = word{"kʷen", "who", "question word"}
	wWhere  = word{"kʷelo", "where", "question word"}
	wWhen   = word{"hamaː", "when", "question word"}
	wHello  = word{"seraːn", "hello", "interjection"}
	wThanks = word{"kaːsu", "thank you", "interjection"}
	wBye    = word{"tʰeliŋ", "goodbye", "interjection"}
	wYes    = word{"ʔiwa", "yes", "interjection"}
	wNo     = word{"mabo", "no", "interjection"}
)

// functionWords lists the words above for the lexicon file.
var functionWords = []word{
	wObj, wLoc, wAll, wAbl, wCom, wPast, wFut, wNeg, wQ, wImp, wPl, wThis, wThat,
	wAnd, wThen, wVery, wCop, wAlso, wWhat, wWho, wWhere, wWhen,
	wHello, wThanks, wBye, wYes, wNo,
}

// lexiconWords returns every word of the lexicon with its gloss and part of
// speech, in no particular order.
func lexiconWords() []word {
	var out []word
	for _, p := range pronouns {
		out = append(out, word{p.form, p.gloss, "pronoun"})
	}
	for _, n := range names {
		out = append(out, word{n.form, n.en + " (name)", "proper noun"})
	}
	for _, n := range nouns {
		out = append(out, word{n.form, n.sg, "noun"})
	}
	for _, v := range verbs {
		out = append(out, word{v.form, v.base, "verb"})
	}
	for _, a := range adjectives {
		out = append(out, word{a.form, a.en, "adjective"})
	}
	for _, n := range numerals {
		out = append(out, word{n.form, n.en, "numeral"})
	}
	for _, t := range timeWords {
		out = append(out, word{t.form, t.en, "adverb"})
	}
	for _, a := range mannerAdverbs {
		out = append(out, word{a.form, a.en, "adverb"})
	}
	for _, a := range placeAdverbs {
		out = append(out, word{a.form, a.en, "adverb"})
	}
	out = append(out, functionWords...)
	return out
}
