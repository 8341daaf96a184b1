using VolCast.Core.Options;

namespace VolCast.Core.Tests.Options;

public sealed class Black76Tests
{
    [Theory]
    [InlineData(OptionType.Call, 100, 100, 0.25, 0.2, 0.05, 0.02)] // at the money
    [InlineData(OptionType.Put, 100, 100, 0.25, 0.2, 0.05, 0.02)] // at the money put
    [InlineData(OptionType.Call, 100, 60, 2, 0.35, 0.03, 0.0)] // deep in the money call
    [InlineData(OptionType.Put, 100, 150, 0.1, 0.5, -0.005, 0.01)] // deep in the money put, negative rate
    [InlineData(OptionType.Call, 42, 40, 0.5, 0.2, 0.1, 0)] // Hull 15.6 inputs
    public void PriceDeltaVega_OnForward_MatchBlackScholesMerton(OptionType type, double spot, double strike, double years, double vol, double rate, double yield)
    {
        // Black-76 on F = S e^{(r−q)T} equals Black-Scholes-Merton (Black 1976; Hull 11e, chapter on futures options [M]).
        // Delta differs by the chain rule: ∂V/∂S = ∂V/∂F · e^{(r−q)T}.
        var forward = BlackScholesMerton.Forward(spot, years, rate, yield);
        Assert.Equal(BlackScholesMerton.Price(type, spot, strike, years, vol, rate, yield), Black76.Price(type, forward, strike, years, vol, rate), 1e-12 * spot);
        Assert.Equal(
            BlackScholesMerton.Delta(type, spot, strike, years, vol, rate, yield),
            Black76.Delta(type, forward, strike, years, vol, rate) * Math.Exp((rate - yield) * years),
            1e-13);
        Assert.Equal(BlackScholesMerton.Vega(spot, strike, years, vol, rate, yield), Black76.Vega(forward, strike, years, vol, rate), 1e-11 * spot);
    }

    [Fact]
    public void Price_PutCallParityOnForward_HoldsTo1e12()
    {
        // Put-call parity on a forward [M]: c − p = e^{−rT}(F − K).
        var call = Black76.Price(OptionType.Call, 105, 100, 0.75, 0.3, 0.04);
        var put = Black76.Price(OptionType.Put, 105, 100, 0.75, 0.3, 0.04);
        Assert.Equal(Math.Exp(-0.04 * 0.75) * 5, call - put, 1e-12);
    }
}
