package recipe

import "saltcast/core/wire"

// Encode writes the result with the CLI keys (see the README's command-line section).
func (res Result) Encode() []byte {
	var e wire.Encoder
	e.BeginObject()
	e.Key("format").Int(CurrentFormat)
	e.Key("name").String(res.Recipe.Name)
	e.Key("solute").String(res.SoluteID)
	e.Key("charged_form").String(res.ChargedForm)
	e.Key("charge_g").Round(res.ChargeG, sig)
	e.Key("water_g").Round(res.WaterG, sig)
	e.EndObject()
	b, err := e.Bytes()
	if err != nil {
		panic(err)
	}
	return b
}

// sig is the number of significant digits in result numbers.
const sig = 6
