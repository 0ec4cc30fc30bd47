using Briefwright.Model.Dynamics;
using Briefwright.Model.Results;

namespace Briefwright.Templating.Tests;

/// <summary>The model's codes and numbers in words: English with plain numbers for the data, the brief's language
/// for the brief.</summary>
public class ResultWordsTests
{
    private static DiscountedOptimum Optimum(bool tail, bool pays) => new("green-book", 6.2, 0.4, tail, 14.5,
        [new HorizonOptimum(40, 5.1, 0.2), new HorizonOptimum(80, 6.2, 0.4), new HorizonOptimum(160, 7.03, 0.6)],
        "UK Green Book, declining from 3.5%", 80, pays);

    [Fact]
    public void Tail_notes_carry_their_numbers_with_plain_minus_signs()
    {
        Assert.Equal("the long-run discount rate (1.0%) does not exceed technology growth (1.5%), so the gain "
            + "beyond the horizon has no finite value and is not counted",
            ResultWords.Data.TailNote(new TailBasis(TailTreatment.NotFinite, 0.01, 0.015, 0.05)));
        Assert.Equal("beyond the horizon the gain is held at its balanced-growth value (-0.30%) and discounted to "
            + "infinity",
            ResultWords.Data.TailNote(new TailBasis(TailTreatment.HeldAtBalancedGrowth, 0.035, 0.015, -0.003)));
    }

    [Fact]
    public void The_discounted_optimum_is_explained_from_its_case()
    {
        string cut = ResultWords.Data.Explanation(Optimum(tail: false, pays: true));
        Assert.StartsWith("Discounting at UK Green Book, declining from 3.5% weighs the early dip", cut);
        Assert.EndsWith("the value maximised is cut at 80 years after the reform, and the optimum moves with that cut "
            + "(5.1 years when the value is cut 40 years after the reform, 6.2 years at 80, 7.0 years at 160).", cut);
        string none = ResultWords.Data.Explanation(Optimum(tail: true, pays: false));
        Assert.Equal("No longer schooling has a positive present value at this discount rate: the early loss of "
            + "workers outweighs the discounted later gain. The value maximised includes the gain beyond the horizon "
            + "(80 years), held at its balanced-growth level and discounted to infinity.", none);
    }

    [Fact]
    public void Codes_read_in_the_brief_language()
    {
        Assert.Equal("the return to schooling does not exceed population growth",
            ResultWords.Data.ClosedFormReason(ClosedFormObstacle.ReturnBelowGrowth));
        Assert.Equal("golden section", ResultWords.Data.Refinement(RefinementMethod.GoldenSection));
        using (BriefLanguage.Use(BriefLanguage.BuiltIn["fr"]))
        {
            Assert.Equal("section dorée", ResultWords.Brief.Refinement(RefinementMethod.GoldenSection));
            var notFinite = new TailBasis(TailTreatment.NotFinite, 0.01, 0.015, 0);
            Assert.Contains("1,0\u202F%", ResultWords.Brief.TailNote(notFinite));
            Assert.StartsWith("années de production par personne de 2026", ResultWords.Brief.PriceBase(2026));
        }
        Assert.Equal(ResultWords.Data.PriceBase(2026), ResultWords.Brief.PriceBase(2026));
    }
}
