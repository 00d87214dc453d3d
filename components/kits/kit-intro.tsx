/** What a power budget is, for someone who has never sized a battery. */
export function KitIntro() {
  return (
    <div className="mt-3 max-w-3xl space-y-2 leading-relaxed text-slate">
      <p>
        Put together the gear for a trip and see its weight and cost. If it runs on batteries, the power budget checks whether they last: each day your devices use some energy, your panels put some back,
        and the batteries make up the difference.
      </p>
      <p>
        Batteries should not be run flat: each kind has a <strong>floor</strong> you stay above (its allowed depth of discharge). The plan <strong>closes</strong> when the batteries stay above that floor
        every day of the trip. Energy is counted in watt-hours (Wh): a 10 W lamp on for 3 hours uses 30 Wh.
      </p>
    </div>
  );
}
