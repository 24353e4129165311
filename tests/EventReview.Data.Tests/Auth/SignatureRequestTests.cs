using EventReview.Core.Evidence;
using EventReview.Data.Auth;

namespace EventReview.Data.Tests.Auth;

/// <summary>The freshness rule for a signature made after re-authenticating at the identity provider.</summary>
public sealed class SignatureRequestTests
{
    private static readonly DateTimeOffset Asked = new(2027, 3, 1, 10, 0, 0, TimeSpan.Zero);
    private static readonly TimeSpan MaxAge = TimeSpan.FromMinutes(5);

    private static SignatureRequest Request() => SignatureRequest.Create("u1", 4, "triage.timing", SignOffMeaning.Reviewed, "Checked.", new string('a', 64), Asked);

    [Fact]
    public void A_sign_in_made_after_asking_to_sign_is_fresh() =>
        Assert.Null(Request().ReauthenticationProblem(Asked.AddSeconds(20), Asked.AddSeconds(25), MaxAge));

    [Fact]
    public void A_session_from_before_the_request_is_refused_even_though_the_person_is_right()
    {
        // What a provider that ignores prompt=login answers: the right person, but their old sign-in time.
        var problem = Request().ReauthenticationProblem(Asked.AddMinutes(-20), Asked.AddSeconds(5), MaxAge);

        Assert.Contains("did not ask for your credentials again", problem, StringComparison.Ordinal);
    }

    [Fact]
    public void A_sign_in_too_long_ago_at_completion_is_refused() =>
        Assert.NotNull(Request().ReauthenticationProblem(Asked.AddSeconds(10), Asked.AddMinutes(6), MaxAge));

    [Fact]
    public void No_auth_time_and_a_time_in_the_future_are_refused()
    {
        Assert.Contains("no auth_time", Request().ReauthenticationProblem(null, Asked.AddSeconds(5), MaxAge), StringComparison.Ordinal);
        Assert.Contains("in the future", Request().ReauthenticationProblem(Asked.AddMinutes(3), Asked.AddSeconds(5), MaxAge), StringComparison.Ordinal);
    }

    [Fact]
    public void Clocks_a_few_seconds_apart_do_not_refuse_an_honest_sign_in() =>
        Assert.Null(Request().ReauthenticationProblem(Asked.AddSeconds(-30), Asked.AddSeconds(10), MaxAge));

    [Fact]
    public void A_request_is_used_once_and_lives_ten_minutes()
    {
        var r = Request();
        Assert.True(r.IsOpen(Asked.AddMinutes(9)));
        Assert.False(r.IsOpen(Asked.AddMinutes(11)));
        r.Use(Asked.AddMinutes(1), signed: true, "Signed.");
        Assert.False(r.IsOpen(Asked.AddMinutes(2)));
    }
}
